import { useState } from 'react';
import { apiFetch, ApiError, KeptOnDevice } from '~/lib/client/api';

export interface ChecklistItem {
  id: string;
  kind: 'guide' | 'record' | 'calculation';
  title: string;
  detail: string;
  url: string | null;
  exists: boolean;
  done: boolean;
}

const KIND: Record<string, string> = { guide: 'Read', record: 'Read', calculation: 'Open' };

/** A subsystem's onboarding route for the signed-in person: tick items off as you go. */
export default function RouteChecklist({
  subsystem,
  items: initial,
  canFollow,
}: {
  subsystem: string;
  items: ChecklistItem[];
  canFollow: boolean;
}) {
  const [items, setItems] = useState(initial);
  const [error, setError] = useState('');
  const [kept, setKept] = useState('');
  const live = items.filter((i) => i.exists);
  const done = live.filter((i) => i.done).length;

  async function toggle(item: ChecklistItem) {
    const next = !item.done;
    setItems((xs) => xs.map((x) => (x.id === item.id ? { ...x, done: next } : x)));
    setError('');
    try {
      await apiFetch(`/api/onboarding/${subsystem}/progress`, {
        method: 'POST',
        json: { itemId: item.id, done: next },
        offline: { label: `Onboarding step ${next ? 'ticked' : 'unticked'}: ‘${item.title}’` },
      });
    } catch (e) {
      if (e instanceof KeptOnDevice) {
        setKept(e.message); // the tick stays; the outbox sends it
        return;
      }
      setItems((xs) => xs.map((x) => (x.id === item.id ? { ...x, done: item.done } : x)));
      setError(e instanceof ApiError ? e.message : 'Could not save your tick; try again.');
    }
  }

  if (items.length === 0)
    return (
      <p className="text-sm text-muted">
        No onboarding route yet. An advisor or lead builds one from this subsystem’s guides, records and calculations.
      </p>
    );
  return (
    <div className="flex flex-col gap-3">
      <div>
        <p className="text-sm" aria-live="polite">
          <strong>{done}</strong> of {live.length} done
        </p>
        <progress
          className="w-full"
          max={live.length || 1}
          value={done}
          aria-label={`Onboarding progress: ${done} of ${live.length}`}
        />
      </div>
      <ol className="flex flex-col gap-2">
        {items.map((item, i) => (
          <li key={item.id} className="flex items-start gap-3">
            <input
              id={`onb-${item.id}`}
              type="checkbox"
              className="mt-1.5 h-4 w-4"
              checked={item.done}
              disabled={!canFollow || !item.exists}
              onChange={() => toggle(item)}
              aria-label={`Done: ${item.title}`}
            />
            <div>
              <span className="text-muted tabular">{i + 1}. </span>
              {item.url ? (
                <a href={item.url} className={item.done ? 'line-through decoration-1' : 'font-semibold'}>
                  {item.title}
                </a>
              ) : (
                <span className="text-muted">{item.title}</span>
              )}
              <p className="text-xs text-muted">
                {KIND[item.kind]} · {item.detail}
              </p>
            </div>
          </li>
        ))}
      </ol>
      {error && (
        <p className="field-error" role="alert">
          {error}
        </p>
      )}
      {kept && (
        <p className="notice text-sm" role="status">
          {kept} <a href="/pending">Changes waiting</a>
        </p>
      )}
    </div>
  );
}
