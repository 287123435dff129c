/**
 * The place to go after signing in. Only paths inside this app are followed, so a crafted
 * link (`?next=https://elsewhere`, `//elsewhere`) cannot send a person off-site.
 */
export function safeNext(next: string | null | undefined, fallback = '/'): string {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return fallback;
  if (next.startsWith('/sign-in')) return fallback;
  return next;
}

/** The sign-in address that comes back to `path` afterwards. */
export function signInPath(path: string): string {
  return path && path !== '/' ? `/sign-in?next=${encodeURIComponent(path)}` : '/sign-in';
}
