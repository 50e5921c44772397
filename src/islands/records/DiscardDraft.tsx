import { useState } from 'react';
import { apiFetch, ApiError } from '~/lib/client/api';

/** Deletes a draft for good, after an explicit second step naming what goes. */
export default function DiscardDraft({ id, title }: { id: string; title: string }) {
  const [asking, setAsking] = useState(false);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState('');
  async function discard() {
    setBusy(true);
    setError('');
    try {
      await apiFetch(`/api/records/${id}`, { method: 'DELETE' });
      window.location.assign('/records');
    } catch (e) {
      setBusy(false);
      setError(e instanceof ApiError ? e.message : 'Could not reach the server; nothing was discarded.');
    }
  }
  if (!asking)
    return (
      <button type="button" className="btn btn-quiet" onClick={() => setAsking(true)}>
        Discard draft
      </button>
    );
  return (
    <div className="alert flex w-full flex-col gap-2 text-sm" role="alertdialog" aria-labelledby="discard-q">
      <p id="discard-q" className="font-semibold">
        Discard the draft “{title}” for good?
      </p>
      <p>Its text, versions, links and attachments go with it. This cannot be undone.</p>
      <div className="flex flex-wrap gap-2">
        <button type="button" className="btn btn-danger" onClick={discard} disabled={busy} autoFocus>
          {busy ? 'Discarding…' : 'Yes, discard it'}
        </button>
        <button type="button" className="btn btn-quiet" onClick={() => setAsking(false)} disabled={busy}>
          Keep the draft
        </button>
      </div>
      {error && (
        <p className="field-error" role="alert">
          {error}
        </p>
      )}
    </div>
  );
}
