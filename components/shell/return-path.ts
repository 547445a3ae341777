/**
 * Where to go after signing in: the page a signed-out person tried to open (e.g. a review link
 * from an e-mail). Only same-origin app paths are accepted, so a crafted link cannot send anyone
 * to another site.
 */
export function safeReturnPath(next: string | string[] | undefined): string | null {
  const value = Array.isArray(next) ? next[0] : next;
  if (!value || !value.startsWith('/') || value.startsWith('//') || value.startsWith('/\\')) return null;
  if (value.startsWith('/sign-in') || value.startsWith('/invite/')) return null;
  return value;
}

/** The sign-in address that returns to `path` afterwards. */
export function signInHrefFor(path: string, search: string): string {
  const target = `${path}${search}`;
  if (!path || path === '/') return '/sign-in?notice=session-ended';
  return `/sign-in?notice=sign-in-to-continue&next=${encodeURIComponent(target)}`;
}
