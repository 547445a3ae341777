import { jwtVerify, SignJWT } from 'jose';

import type { Role } from '../../shared/contracts/roles.ts';

/** Claims carried by a session token; `tv` must equal the user's token version. */
export interface SessionClaims {
  sub: string;
  role: Role;
  tv: number;
}

/** Verified tokens remembered at most (the oldest go first). */
const MAX_VERIFIED = 10_000;

export class TokenService {
  private readonly key: Uint8Array;
  /**
   * Tokens whose signature and claims were verified, with their expiry (ms): a session sends the
   * same token with every request, and HMAC verification through WebCrypto costs more CPU than the
   * rest of a cached read. Only valid tokens are kept, so garbage cannot fill it.
   */
  private readonly verified = new Map<string, { claims: SessionClaims; expiresMs: number }>();

  constructor(
    secret: string,
    private readonly ttl: string,
  ) {
    this.key = new TextEncoder().encode(secret);
  }

  /** Signs a short-lived HS256 token. */
  issue(claims: SessionClaims): Promise<string> {
    return new SignJWT({ role: claims.role, tv: claims.tv })
      .setProtectedHeader({ alg: 'HS256' })
      .setSubject(claims.sub)
      .setIssuer('holonaut')
      .setIssuedAt()
      .setExpirationTime(this.ttl)
      .sign(this.key);
  }

  /** Verifies signature, algorithm, issuer and expiry; null for any invalid token. */
  async verify(token: string): Promise<SessionClaims | null> {
    const known = this.verified.get(token);
    if (known) {
      // jose's rule: valid while the current second is before `exp`.
      if (Date.now() < known.expiresMs) return known.claims;
      this.verified.delete(token);
      return null;
    }
    try {
      const { payload } = await jwtVerify(token, this.key, { algorithms: ['HS256'], issuer: 'holonaut' });
      if (typeof payload.sub !== 'string' || typeof payload.tv !== 'number' || typeof payload.role !== 'string') return null;
      const claims: SessionClaims = { sub: payload.sub, role: payload.role as Role, tv: payload.tv };
      if (typeof payload.exp === 'number') {
        if (this.verified.size >= MAX_VERIFIED) this.verified.delete(this.verified.keys().next().value!);
        this.verified.set(token, { claims, expiresMs: payload.exp * 1000 });
      }
      return claims;
    } catch {
      return null;
    }
  }
}

/** Name of the httpOnly session cookie used by the web app. */
export const SESSION_COOKIE = 'holonaut_session';
