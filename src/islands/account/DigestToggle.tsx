import { useState } from 'react';
import { apiFetch, ApiError } from '~/lib/client/api';

export default function DigestToggle({ initial }: { initial: boolean }) {
  const [on, setOn] = useState(initial);
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<{ kind: 'ok' | 'error'; text: string } | null>(null);
  async function change(next: boolean) {
    setOn(next); // show the choice at once; put it back if the server refuses
    setBusy(true);
    setMessage(null);
    try {
      const res = await apiFetch<{ digestOptIn: boolean }>('/api/me', { method: 'PATCH', json: { digestOptIn: next } });
      setOn(res.digestOptIn);
      setMessage({
        kind: 'ok',
        text: res.digestOptIn ? 'You will get the weekly digest.' : 'The weekly digest is off.',
      });
    } catch (e) {
      setOn(!next);
      setMessage({
        kind: 'error',
        text: e instanceof ApiError ? e.message : 'Could not reach the server; nothing changed.',
      });
    } finally {
      setBusy(false);
    }
  }
  return (
    <div className="flex flex-col gap-2">
      <label className="flex items-center gap-2">
        <input type="checkbox" checked={on} disabled={busy} onChange={(e) => change(e.target.checked)} />
        <span>Send me the weekly digest by e-mail</span>
      </label>
      <div aria-live="polite">
        {message && (
          <p
            role={message.kind === 'error' ? 'alert' : 'status'}
            className={message.kind === 'error' ? 'field-error' : 'text-sm text-accent'}
          >
            {message.text}
          </p>
        )}
      </div>
    </div>
  );
}
