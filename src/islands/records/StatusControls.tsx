import { useState } from 'react';
import useSWR from 'swr';
import { apiFetch, ApiError, fetcher } from '~/lib/client/api';
import type { RecordKind } from '~/lib/record-rules';
import { statusInfo } from '~/lib/record-status';

const VERB: Record<string, string> = {
  proposed: 'Propose to the team',
  accepted: 'Mark accepted',
  withdrawn: 'Withdraw',
  superseded: 'Supersede…',
  addressed: 'Mark addressed',
};

/**
 * The status moves this person may make on this record now (worked out by the page from the lifecycle and the
 * policy); superseding asks which record replaces it. A thin decision is flagged before it is proposed, and
 * acceptance that still needs a review is shown, not offered.
 */
export default function StatusControls({
  id,
  kind,
  version,
  subsystem,
  moves,
  acceptBlocked,
  thin,
  editUrl,
}: {
  id: string;
  kind: RecordKind;
  version: number;
  subsystem: string;
  moves: string[];
  /** Why accepting is not possible yet (no review of this version); null when it is. */
  acceptBlocked: string | null;
  /** Sections a decision should not be proposed without, empty or missing in its text. */
  thin: string[];
  editUrl: string | null;
}) {
  const [confirmThin, setConfirmThin] = useState(false);
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
  const thinWarning =
    kind === 'decision' && moves.includes('proposed') && thin.length > 0
      ? `Nothing is written under ${thin.map((t) => `“${t}”`).join(' and ')} yet. A reviewer will ask what else you weighed and what this decision costs; a decision without them rarely survives the next season.`
      : null;

  async function move(to: string) {
    if (to === 'proposed' && thinWarning && !confirmThin) {
      setConfirmThin(true);
      return;
    }
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

  // Only an accepted decision can replace one (the server refuses anything else).
  const options = (candidates.data?.records ?? []).filter((r) => r.id !== id && r.status === 'accepted');
  return (
    <div className="flex flex-col gap-2">
      {thinWarning && (
        <div className="notice text-sm" role="note" id="thin-warning">
          <p className="font-semibold">A thin decision</p>
          <p>{thinWarning}</p>
        </div>
      )}
      {confirmThin ? (
        <div className="flex flex-wrap gap-2" role="group" aria-label="Propose this thin decision?">
          <button
            type="button"
            className="btn btn-primary text-sm"
            disabled={busy}
            onClick={() => move('proposed')}
            aria-describedby="thin-warning"
          >
            Propose it anyway
          </button>
          {editUrl ? (
            <a className="btn btn-quiet text-sm" href={editUrl}>
              Keep writing
            </a>
          ) : (
            <button type="button" className="btn btn-quiet text-sm" onClick={() => setConfirmThin(false)}>
              Not yet
            </button>
          )}
        </div>
      ) : (
        <div className="flex flex-wrap gap-2">
          {moves.map((to) => {
            const blocked = to === 'accepted' ? acceptBlocked : null;
            return (
              <button
                key={to}
                type="button"
                className="btn btn-quiet text-sm"
                disabled={busy || !!blocked}
                aria-describedby={blocked ? 'accept-blocked' : undefined}
                onClick={() => move(to)}
              >
                <span aria-hidden="true">{statusInfo(to).symbol}</span> {VERB[to] ?? statusInfo(to).label}
              </button>
            );
          })}
        </div>
      )}
      {acceptBlocked && moves.includes('accepted') && (
        <p id="accept-blocked" className="text-xs text-muted">
          {acceptBlocked}
        </p>
      )}
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
