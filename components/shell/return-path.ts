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

// The address the page was opened at, read once when the bundle loads (web): the router may
// reroute before the session check finishes, so this is the only reliable record of it.
let entryPath: string | null =
  typeof window !== 'undefined' && window.location ? `${window.location.pathname}${window.location.search}` : null;

/** The address the app was opened at, handed out once (later redirects use the current route). */
export function takeEntryPath(): string | null {
  const value = entryPath;
  entryPath = null;
  return value;
}
