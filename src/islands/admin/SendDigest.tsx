import { useState } from 'react';
import { apiFetch, ApiError } from '~/lib/client/api';

interface Run {
  since: string;
  recipients: number;
  sent: number;
  failed: number;
  skipped: number;
}

export default function SendDigest() {
  const [busy, setBusy] = useState(false);
  const [result, setResult] = useState<{ kind: 'ok' | 'error'; text: string } | null>(null);
  async function send() {
    setBusy(true);
    setResult(null);
    try {
      const run = await apiFetch<Run>('/api/digest/send', { method: 'POST', json: {} });
      setResult({
        kind: run.failed ? 'error' : 'ok',
        text: `${run.sent} sent, ${run.skipped} with nothing new for them, ${run.failed} failed (${run.recipients} opted in; news since ${run.since.slice(0, 10)}).`,
      });
    } catch (e) {
      setResult({ kind: 'error', text: e instanceof ApiError ? e.message : 'Could not reach the server; try again.' });
    } finally {
      setBusy(false);
    }
  }
  return (
    <div className="flex flex-col gap-2">
      <button type="button" className="btn btn-primary self-start" onClick={send} disabled={busy}>
        {busy ? 'Sending…' : 'Send the digest now'}
      </button>
      <div aria-live="polite">
        {result && (
          <p
            role={result.kind === 'error' ? 'alert' : 'status'}
            className={result.kind === 'error' ? 'alert' : 'notice'}
          >
            {result.text}
          </p>
        )}
      </div>
    </div>
  );
}
