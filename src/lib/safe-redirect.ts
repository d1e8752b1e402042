/**
 * The `next` parameter comes from the address bar, so only same-site paths are honoured;
 * anything else (absolute URLs, protocol-relative `//host`, back-slash tricks) goes home.
 */
export function safeNextPath(next: string | null | undefined): string {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.includes('\\')) return '/';
  return next;
}

export function signInPathFor(location: { pathname: string; search: string }): string {
  const back = `${location.pathname}${location.search}`;
  return back === '/' ? '/sign-in' : `/sign-in?next=${encodeURIComponent(back)}`;
}
