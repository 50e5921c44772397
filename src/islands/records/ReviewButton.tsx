import { useState } from 'react';
import { apiFetch, ApiError } from '~/lib/client/api';

/** Marks a record's version or a guide reviewed: `url` is the review route, `label` the button's words. */
export default function ReviewButton({ url, label }: { url: string; label: string }) {
  const [note, setNote] = useState('');
  const [state, setState] = useState<'idle' | 'busy' | 'error'>('idle');
  const [error, setError] = useState('');
  async function review() {
    setState('busy');
    try {
      await apiFetch(url, { method: 'POST', json: note.trim() ? { note: note.trim() } : {} });
      window.location.reload();
    } catch (e) {
      setState('error');
      setError(e instanceof ApiError ? e.message : 'Could not reach the server; try again.');
    }
  }
  return (
    <div className="flex flex-col gap-2">
      <label htmlFor="review-note" className="text-sm font-semibold">
        Review note <span className="font-normal text-muted">(optional)</span>
      </label>
      <textarea
        id="review-note"
        className="input min-h-16 text-sm"
        value={note}
        onChange={(e) => setNote(e.target.value)}
        maxLength={1000}
      />
      <button type="button" className="btn btn-quiet text-sm" onClick={review} disabled={state === 'busy'}>
        {label}
      </button>
      {state === 'error' && (
        <p className="field-error" role="alert">
          {error}
        </p>
      )}
    </div>
  );
}
