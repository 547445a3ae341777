import { createHash, randomBytes } from 'node:crypto';

/** A fresh 256-bit invitation secret, URL-safe; only its hash is stored. */
export function newInvitationToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, hash: hashInvitationToken(token) };
}

export function hashInvitationToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

/** Invitations expire after this long. */
export const INVITATION_TTL_MS = 7 * 24 * 3600 * 1000;
