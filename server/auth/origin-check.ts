import type { NextFunction, Request, Response } from 'express';

import type { Config } from '../config.ts';
import { HttpError } from '../http/http-error.ts';
import { SESSION_COOKIE } from './tokens.ts';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

const crossSite = () => new HttpError(403, 'cross_origin', 'This change came from another site and was refused. Reload Holonaut and try again.');

/** The origin ("scheme://host[:port]") of a URL, or null when it is not one. */
function originOf(url: string): string | null {
  try {
    const u = new URL(url);
    return u.origin === 'null' ? null : u.origin;
  } catch {
    return null;
  }
}

/**
 * Cross-site request forgery guard: a state-changing request that a browser could send with the
 * session cookie must come from one of our own origins (the server's own host, PUBLIC_URL or
 * ALLOWED_ORIGINS), as its Origin header (or, when a browser omits that, its Referer) says. Requests
 * with an `Authorization: Bearer` header are exempt: a foreign page cannot set that header without
 * a CORS preflight, which this server never grants. A request without the cookie that still
 * names a foreign origin (a cross-site sign-in form) is refused too.
 */
export function originCheck(config: Config) {
  const configured = [config.PUBLIC_URL, ...config.ALLOWED_ORIGINS].map((u) => (u ? originOf(u) : null)).filter((o): o is string => !!o);
  return (req: Request, _res: Response, next: NextFunction) => {
    if (SAFE_METHODS.has(req.method)) return next();
    if (req.headers.authorization?.startsWith('Bearer ')) return next();
    const claimed = req.headers.origin ?? (req.headers.referer ? originOf(req.headers.referer) ?? 'null' : undefined);
    const hasCookie = !!(req.cookies as Record<string, string> | undefined)?.[SESSION_COOKIE];
    if (claimed === undefined) return hasCookie ? next(crossSite()) : next();
    const own = `${req.protocol}://${req.get('host') ?? ''}`;
    if (claimed === own || configured.includes(claimed)) return next();
    next(crossSite());
  };
}
