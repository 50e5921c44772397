import { useState } from 'react';
import { apiFetch, ApiError } from '~/lib/client/api';
import { formatNumber } from '~/lib/format';

interface Change {
  name: string;
  before: unknown;
  after: unknown;
}

/** Recomputes a saved calculation with today's engine and shows what changed; the earlier result is kept. */
export default function RecomputeButton({
  id,
  labels,
}: {
  id: string;
  labels: Record<string, { label: string; unit: string; digits: number }>;
}) {
  const [state, setState] = useState<'idle' | 'busy' | 'done' | 'error'>('idle');
  const [changes, setChanges] = useState<Change[]>([]);
  const [message, setMessage] = useState('');

  async function recompute() {
    setState('busy');
    try {
      const res = await apiFetch<{ changes: Change[]; calculation: { engineVersion: string } }>(
        `/api/calculations/${id}/recompute`,
        { method: 'POST' },
      );
      setChanges(res.changes);
      setMessage(`Recomputed with engine ${res.calculation.engineVersion}.`);
      setState('done');
    } catch (e) {
      setMessage(e instanceof ApiError ? e.message : 'Could not reach the server; try again.');
      setState('error');
    }
  }

  return (
    <div className="flex flex-col gap-2">
      <div className="flex flex-wrap items-center gap-3">
        <button type="button" className="btn btn-quiet" onClick={recompute} disabled={state === 'busy'}>
          {state === 'busy' ? 'Recomputing…' : 'Recompute with today’s engine'}
        </button>
        {state === 'done' && (
          <a className="btn btn-quiet" href={`/calculations/${id}`}>
            Reload to see the new result
          </a>
        )}
      </div>
      <div aria-live="polite">
        {message && <p className={state === 'error' ? 'alert' : 'text-sm'}>{message}</p>}
        {state === 'done' && changes.length === 0 && <p className="text-sm text-muted">No output changed.</p>}
        {state === 'done' && changes.length > 0 && (
          <table className="tabular mt-2 border-collapse text-sm">
            <caption className="text-left font-semibold">What changed</caption>
            <thead>
              <tr>
                <th scope="col" className="pr-3 text-left">
                  Output
                </th>
                <th scope="col" className="pr-3 text-right">
                  Before
                </th>
                <th scope="col" className="text-right">
                  Now
                </th>
              </tr>
            </thead>
            <tbody>
              {changes.map((c) => {
                const l = labels[c.name];
                return (
                  <tr key={c.name}>
                    <th scope="row" className="pr-3 text-left font-medium">
                      {l?.label ?? c.name}
                    </th>
                    <td className="pr-3 text-right">
                      {formatNumber(c.before, l?.digits ?? 3)} {l?.unit}
                    </td>
                    <td className="text-right">
                      {formatNumber(c.after, l?.digits ?? 3)} {l?.unit}
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        )}
      </div>
    </div>
  );
}
