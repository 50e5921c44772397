import { useDeferredValue, useMemo, useState, type DragEvent } from 'react';
import type { SearchHit } from '~/lib/search-types';
import useSWR from 'swr';
import { apiFetch, ApiError, fetcher } from '~/lib/client/api';

interface Item {
  kind: 'guide' | 'record' | 'calculation';
  ref: string;
  title: string;
  detail: string;
}

/** Advisors and leads arrange a route: drag (or move with buttons) to reorder, add by searching, remove. */
export default function RouteCurator({ subsystem, initial }: { subsystem: string; initial: Item[] }) {
  const [items, setItems] = useState<Item[]>(initial);
  const [query, setQuery] = useState('');
  const [dragging, setDragging] = useState<number | null>(null);
  const [status, setStatus] = useState<{ tone: 'ok' | 'error'; text: string } | null>(null);
  const [saving, setSaving] = useState(false);
  const guides = useSWR<{ guides: { slug: string; title: string; subsystem: string }[] }>('/api/guides', fetcher);
  const records = useSWR<{ records: { id: string; title: string; kind: string; season: string; subsystem: string }[] }>(
    '/api/records?limit=100',
    fetcher,
  );
  const calcs = useSWR<{ calculations: { id: string; title: string; season: string; subsystem: string }[] }>(
    '/api/calculations?limit=100',
    fetcher,
  );
  // Titles are matched here; the site's search also finds words in bodies, guides' text and calculation notes.
  const searchFor = useDeferredValue(query.trim());
  const found = useSWR<{ hits: SearchHit[] }>(
    searchFor.length >= 2 ? `/api/search?q=${encodeURIComponent(searchFor)}&limit=20` : null,
    fetcher,
  );

  const candidates: Item[] = useMemo(() => {
    const all: (Item & { sub: string })[] = [
      ...(guides.data?.guides ?? []).map((g) => ({
        kind: 'guide' as const,
        ref: g.slug,
        title: g.title,
        detail: 'Guide',
        sub: g.subsystem,
      })),
      ...(records.data?.records ?? []).map((r) => ({
        kind: 'record' as const,
        ref: r.id,
        title: r.title,
        detail: `${r.kind === 'decision' ? 'Decision' : 'Lesson'} · ${r.season}`,
        sub: r.subsystem,
      })),
      ...(calcs.data?.calculations ?? []).map((c) => ({
        kind: 'calculation' as const,
        ref: c.id,
        title: c.title,
        detail: `Calculation · ${c.season}`,
        sub: c.subsystem,
      })),
    ];
    const q = query.trim().toLowerCase();
    const taken = new Set(items.map((i) => `${i.kind}:${i.ref}`));
    const byTitle = all.filter((c) => (q ? `${c.title} ${c.detail}`.toLowerCase().includes(q) : c.sub === subsystem));
    const seen = new Set(byTitle.map((c) => `${c.kind}:${c.ref}`));
    const byText: Item[] = q
      ? (found.data?.hits ?? [])
          .map((h) => ({
            kind:
              h.type === 'guide'
                ? ('guide' as const)
                : h.type === 'calculation'
                  ? ('calculation' as const)
                  : ('record' as const),
            ref: h.id,
            title: h.title,
            detail: `${h.type === 'guide' ? 'Guide' : h.type === 'calculation' ? 'Calculation' : h.type === 'decision' ? 'Decision' : 'Lesson'}${h.season ? ` · ${h.season}` : ''} · found in its text`,
          }))
          .filter((c) => !seen.has(`${c.kind}:${c.ref}`))
      : [];
    return [...byTitle, ...byText].filter((c) => !taken.has(`${c.kind}:${c.ref}`)).slice(0, 12);
  }, [guides.data, records.data, calcs.data, found.data, query, items, subsystem]);

  const move = (from: number, to: number) => {
    if (to < 0 || to >= items.length || from === to) return;
    setItems((xs) => {
      const next = [...xs];
      const [it] = next.splice(from, 1);
      next.splice(to, 0, it);
      return next;
    });
  };
  const onDrop = (e: DragEvent, to: number) => {
    e.preventDefault();
    if (dragging !== null) move(dragging, to);
    setDragging(null);
  };

  async function save() {
    setSaving(true);
    setStatus(null);
    try {
      await apiFetch(`/api/onboarding/${subsystem}`, {
        method: 'PUT',
        json: { items: items.map(({ kind, ref }) => ({ kind, ref })) },
      });
      setStatus({ tone: 'ok', text: 'Route saved. Everyone’s ticks are kept.' });
    } catch (e) {
      setStatus({
        tone: 'error',
        text:
          e instanceof ApiError
            ? e.body?.error.issues.map((i) => i.message).join(' ') || e.message
            : 'Could not reach the server; try again.',
      });
    } finally {
      setSaving(false);
    }
  }

  return (
    <div className="flex flex-col gap-4">
      <ol className="flex flex-col gap-1" aria-label="Route items in order">
        {items.map((it, i) => (
          <li
            key={`${it.kind}:${it.ref}`}
            draggable
            onDragStart={() => setDragging(i)}
            onDragOver={(e) => e.preventDefault()}
            onDrop={(e) => onDrop(e, i)}
            className={`flex items-center gap-2 rounded border bg-surface p-2 text-sm ${dragging === i ? 'border-accent' : 'border-line'}`}
          >
            <span aria-hidden="true" className="cursor-grab select-none text-muted" title="Drag to reorder">
              ⋮⋮
            </span>
            <span className="tabular text-muted">{i + 1}.</span>
            <span className="flex-1">
              <span className="font-medium">{it.title}</span> <span className="text-muted">· {it.detail}</span>
            </span>
            <button
              type="button"
              className="btn btn-quiet px-2 py-0.5 text-xs"
              onClick={() => move(i, i - 1)}
              disabled={i === 0}
              aria-label={`Move ${it.title} up`}
            >
              ↑
            </button>
            <button
              type="button"
              className="btn btn-quiet px-2 py-0.5 text-xs"
              onClick={() => move(i, i + 1)}
              disabled={i === items.length - 1}
              aria-label={`Move ${it.title} down`}
            >
              ↓
            </button>
            <button
              type="button"
              className="btn btn-quiet px-2 py-0.5 text-xs"
              onClick={() => setItems((xs) => xs.filter((_, j) => j !== i))}
              aria-label={`Remove ${it.title}`}
            >
              ✕
            </button>
          </li>
        ))}
        {items.length === 0 && <li className="text-sm text-muted">The route is empty. Add items below.</li>}
      </ol>
      <div className="field">
        <label htmlFor={`add-${subsystem}`}>Add by search</label>
        <input
          id={`add-${subsystem}`}
          className="input"
          value={query}
          onChange={(e) => setQuery(e.target.value)}
          placeholder="Words from a title or text (empty: this subsystem’s own)"
        />
      </div>
      <ul className="flex flex-col gap-1" aria-label="Items you can add">
        {candidates.map((c) => (
          <li key={`${c.kind}:${c.ref}`}>
            <button
              type="button"
              className="w-full rounded p-1.5 text-left text-sm hover:bg-sunken"
              onClick={() => setItems((xs) => [...xs, c])}
            >
              <span aria-hidden="true">＋ </span>
              <span className="font-medium">{c.title}</span> <span className="text-muted">· {c.detail}</span>
            </button>
          </li>
        ))}
      </ul>
      <div className="flex items-center gap-3">
        <button type="button" className="btn btn-primary" onClick={save} disabled={saving}>
          {saving ? 'Saving…' : 'Save route'}
        </button>
        {status && (
          <p
            className={status.tone === 'ok' ? 'text-sm' : 'field-error'}
            role={status.tone === 'ok' ? 'status' : 'alert'}
          >
            {status.text}
          </p>
        )}
      </div>
    </div>
  );
}
