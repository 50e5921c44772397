// The offline page's list of what this device keeps: the pages in the kept person's cache, grouped by what the
// offline pack says they are (guides, records, calculations, calculators, onboarding), then any other page opened.
import {
  KEPT_AT,
  PACK_GROUPS,
  PACK_KEY,
  keptPerson,
  metaCache,
  pagesCache,
  type KeptPack,
  type PackGroup,
} from '../offline/names';

const HEADINGS: Record<PackGroup | 'other', string> = {
  guides: 'Guides',
  records: 'Decision records and lessons',
  calculations: 'Saved calculations',
  calculators: 'Calculators',
  onboarding: 'Onboarding',
  other: 'Other pages you opened',
};

const when = (iso: string): string =>
  iso ? new Date(iso).toLocaleString(undefined, { dateStyle: 'medium', timeStyle: 'short' }) : 'at an unknown time';

const titleOf = (html: string): string =>
  (/<title>([^<]*)<\/title>/.exec(html)?.[1] ?? '')
    .replace(/ · Wakebook$/, '')
    .replace(/&amp;/g, '&')
    .replace(/&lt;/g, '<')
    .replace(/&gt;/g, '>')
    .replace(/&quot;/g, '"')
    .replace(/&#39;/g, "'");

interface Kept {
  url: string;
  title: string;
  keptAt: string;
}

export async function listKeptPages(spot: HTMLElement | null): Promise<void> {
  if (!spot) return;
  const person = 'caches' in window ? keptPerson(await caches.keys()) : null;
  const kept = new Map<string, Kept>();
  let pack: KeptPack | null = null;
  if (person) {
    const pages = await caches.open(pagesCache(person));
    for (const request of await pages.keys()) {
      const response = await pages.match(request);
      // Attachments are kept beside the pages that show them; the list names pages only.
      if (!response?.headers.get('content-type')?.startsWith('text/html')) continue;
      const url = new URL(request.url);
      const path = url.pathname + url.search;
      kept.set(path, { url: path, title: '', keptAt: response.headers.get(KEPT_AT) ?? '' });
    }
    const stored = await (await caches.open(metaCache(person))).match(PACK_KEY);
    pack = stored ? ((await stored.json()) as KeptPack) : null;
  }
  const groups = new Map<PackGroup | 'other', Kept[]>();
  for (const group of PACK_GROUPS) {
    for (const item of pack?.groups[group] ?? []) {
      const page = kept.get(item.url);
      if (!page) continue;
      kept.delete(item.url);
      groups.set(group, [...(groups.get(group) ?? []), { ...page, title: item.title }]);
    }
  }
  if (person) {
    const pages = await caches.open(pagesCache(person));
    for (const page of kept.values()) {
      const html = (await (await pages.match(page.url))?.text()) ?? '';
      groups.set('other', [...(groups.get('other') ?? []), { ...page, title: titleOf(html) || page.url }]);
    }
  }

  spot.replaceChildren();
  if (groups.size === 0) {
    const p = document.createElement('p');
    p.textContent =
      'Nothing is kept on this device yet. Sign in and open Wakebook once with a network: your guides, records, calculations and onboarding route are then kept for reading offline.';
    spot.append(p);
    return;
  }
  for (const [group, items] of [...groups.entries()].sort(
    ([a], [b]) => [...PACK_GROUPS, 'other'].indexOf(a) - [...PACK_GROUPS, 'other'].indexOf(b),
  )) {
    const section = document.createElement('section');
    section.className = 'mt-6';
    const h2 = document.createElement('h2');
    h2.className = 'font-serif text-xl font-semibold';
    h2.textContent = `${HEADINGS[group]} (${items.length})`;
    const list = document.createElement('ul');
    list.className = 'mt-2 space-y-1';
    for (const item of items.sort((a, b) => a.title.localeCompare(b.title))) {
      const li = document.createElement('li');
      const a = document.createElement('a');
      a.href = item.url;
      a.textContent = item.title;
      const small = document.createElement('span');
      small.className = 'text-sm text-muted';
      small.textContent = ` — kept ${when(item.keptAt)}`;
      li.append(a, small);
      list.append(li);
    }
    section.append(h2, list);
    spot.append(section);
  }
}
