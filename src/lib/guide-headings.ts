// A guide's section headings (## and ###) read from its MDX source, skipping fenced code. Pure, so the suggestion
// form, the server's check of a suggested section and the unit tests all agree without rendering the MDX.

export interface GuideHeading {
  depth: 2 | 3;
  text: string;
}

export function guideHeadings(mdx: string): GuideHeading[] {
  const out: GuideHeading[] = [];
  let fence: string | null = null;
  for (const line of mdx.split('\n')) {
    const f = /^\s*(```|~~~)/.exec(line);
    if (f) {
      fence = fence === null ? f[1] : fence === f[1] ? null : fence;
      continue;
    }
    if (fence) continue;
    const h = /^(#{2,3})\s+(.+?)\s*#*\s*$/.exec(line);
    if (h)
      out.push({
        depth: h[1].length as 2 | 3,
        // Headings are plain words in our guides; strip inline emphasis and code marks for display.
        text: h[2].replace(/[*_`]/g, '').trim(),
      });
  }
  return out;
}
