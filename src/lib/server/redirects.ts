/** Only same-site paths are followed after sign-in, never another origin (open-redirect guard). */
export function safeNext(next: string | null | undefined): string {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return '/';
  if (next.startsWith('/sign-in') || next.startsWith('/sign-out')) return '/';
  return next;
}

export function signInPath(url: URL): string {
  const next = url.pathname + url.search;
  return next === '/' ? '/sign-in' : `/sign-in?next=${encodeURIComponent(next)}`;
}
