// The useId prefix of each island of a page: the same on the server render and the browser's hydration, and
// different for two islands of one page. Counted per request, so the same page renders the same bytes (ETag).
const counts = new WeakMap<Request, number>();

export function nextIslandPrefix(request: Request): string {
  const n = counts.get(request) ?? 0;
  counts.set(request, n + 1);
  return `i${n}-`;
}
