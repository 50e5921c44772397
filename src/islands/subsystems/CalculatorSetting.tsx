import { useState } from 'react';
import { apiFetch, ApiError } from '~/lib/client/api';

/** A lead says whether calculators apply to a subsystem; readiness then asks (or stops asking) for linked calculations. */
export default function CalculatorSetting({ slug, initial }: { slug: string; initial: boolean }) {
  const [on, setOn] = useState(initial);
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<{ tone: 'ok' | 'error'; text: string } | null>(null);
  async function change(next: boolean) {
    setBusy(true);
    setMessage(null);
    try {
      await apiFetch(`/api/subsystems/${slug}`, { method: 'PATCH', json: { calculationsApply: next } });
      setOn(next);
      setMessage({ tone: 'ok', text: 'Saved. Reload the page to see the readiness score change.' });
    } catch (e) {
      setMessage({ tone: 'error', text: e instanceof ApiError ? e.message : 'Could not reach the server; try again.' });
    } finally {
      setBusy(false);
    }
  }
  return (
    <div className="flex flex-col gap-2 text-sm">
      <label className="flex items-start gap-2">
        <input
          type="checkbox"
          className="mt-1"
          checked={on}
          disabled={busy}
          onChange={(e) => change(e.target.checked)}
        />
        <span>
          Calculators apply to this subsystem
          <span className="block text-muted">
            When ticked, readiness expects every accepted decision to link a saved calculation.
          </span>
        </span>
      </label>
      {message && (
        <p className={message.tone === 'ok' ? '' : 'field-error'} role={message.tone === 'ok' ? 'status' : 'alert'}>
          {message.text}
        </p>
      )}
    </div>
  );
}
