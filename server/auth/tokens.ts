import { jwtVerify, SignJWT } from 'jose';

import type { Role } from '../../shared/contracts/roles.ts';

/** Claims carried by a session token; `tv` must equal the user's token version. */
export interface SessionClaims {
  sub: string;
  role: Role;
  tv: number;
}

export class TokenService {
  private readonly key: Uint8Array;

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
    try {
      const { payload } = await jwtVerify(token, this.key, { algorithms: ['HS256'], issuer: 'holonaut' });
      if (typeof payload.sub !== 'string' || typeof payload.tv !== 'number' || typeof payload.role !== 'string') return null;
      return { sub: payload.sub, role: payload.role as Role, tv: payload.tv };
    } catch {
      return null;
    }
  }
}

/** Name of the httpOnly session cookie used by the web app. */
export const SESSION_COOKIE = 'holonaut_session';
