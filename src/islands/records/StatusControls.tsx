import { useState } from 'react';
import useSWR from 'swr';
import { apiFetch, ApiError, fetcher } from '~/lib/client/api';
import { nextStatuses, type RecordKind } from '~/lib/record-rules';
import { statusInfo } from '~/lib/record-status';

const VERB: Record<string, string> = {
  proposed: 'Propose to the team',
  accepted: 'Mark accepted',
  withdrawn: 'Withdraw',
  superseded: 'Supersede…',
  addressed: 'Mark addressed',
};

/** The status moves this record may make now; superseding asks which record replaces it. */
export default function StatusControls({
  id,
  kind,
  status,
  version,
  subsystem,
}: {
  id: string;
  kind: RecordKind;
  status: string;
  version: number;
  subsystem: string;
}) {
  const moves = nextStatuses(kind, status);
  const [picking, setPicking] = useState(false);
  const [replacement, setReplacement] = useState('');
  const [error, setError] = useState('');
  const [busy, setBusy] = useState(false);
  const candidates = useSWR<{ records: { id: string; title: string; status: string; season: string }[] }>(
    picking ? `/api/records?kind=decision&subsystem=${encodeURIComponent(subsystem)}&limit=100` : null,
    fetcher,
  );
  if (moves.length === 0)
    return <p className="text-sm text-muted">No further status change: this record’s story is complete.</p>;

  async function move(to: string) {
    if (to === 'superseded' && !picking) {
      setPicking(true);
      return;
    }
    if (to === 'withdrawn' && !window.confirm('Withdraw this decision? It stays readable, marked withdrawn.')) return;
    setBusy(true);
    setError('');
    try {
      await apiFetch(`/api/records/${id}/status`, {
        method: 'POST',
        json: { status: to, version, ...(to === 'superseded' ? { supersededBy: replacement } : {}) },
      });
      window.location.reload();
    } catch (e) {
      setBusy(false);
      setError(
        e instanceof ApiError ? (e.fieldErrors().supersededBy ?? e.message) : 'Could not reach the server; try again.',
      );
    }
  }

  const options = (candidates.data?.records ?? []).filter(
    (r) => r.id !== id && !['superseded', 'withdrawn'].includes(r.status),
  );
  return (
    <div className="flex flex-col gap-2">
      <div className="flex flex-wrap gap-2">
        {moves.map((to) => (
          <button key={to} type="button" className="btn btn-quiet text-sm" disabled={busy} onClick={() => move(to)}>
            <span aria-hidden="true">{statusInfo(to).symbol}</span> {VERB[to] ?? statusInfo(to).label}
          </button>
        ))}
      </div>
      {picking && (
        <div className="flex flex-col gap-2 rounded border border-line p-2">
          <label htmlFor="supersede-by" className="text-sm font-semibold">
            Which decision replaces this one?
          </label>
          <select
            id="supersede-by"
            className="input text-sm"
            value={replacement}
            onChange={(e) => setReplacement(e.target.value)}
          >
            <option value="">{candidates.isLoading ? 'Loading…' : 'Choose a decision record'}</option>
            {options.map((r) => (
              <option key={r.id} value={r.id}>
                {r.title} ({r.season}, {r.status})
              </option>
            ))}
          </select>
          <p className="text-xs text-muted">
            Write the new decision first if it does not exist yet; both records will show the link.
          </p>
          <div className="flex gap-2">
            <button
              type="button"
              className="btn btn-primary text-sm"
              disabled={!replacement || busy}
              onClick={() => move('superseded')}
            >
              Supersede
            </button>
            <button type="button" className="btn btn-quiet text-sm" onClick={() => setPicking(false)}>
              Cancel
            </button>
          </div>
        </div>
      )}
      {error && (
        <p className="field-error" role="alert">
          {error}
        </p>
      )}
    </div>
  );
}
