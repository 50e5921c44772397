import { useState } from 'react';
import { apiFetch, ApiError } from '~/lib/client/api';

type Field = 'digestOptIn' | 'notifyQuestions' | 'notifyAnswers';

export interface EmailChoice {
  field: Field;
  label: string;
  /** What the status line says once the server has it, on and off. */
  onText: string;
  offText: string;
  initial: boolean;
}

/** On/off choices about e-mail, each saved at once through PATCH /api/me. */
export default function EmailChoices({ choices }: { choices: EmailChoice[] }) {
  return (
    <div className="flex flex-col gap-3">
      {choices.map((c) => (
        <Choice key={c.field} choice={c} />
      ))}
    </div>
  );
}

function Choice({ choice }: { choice: EmailChoice }) {
  const [on, setOn] = useState(choice.initial);
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<{ kind: 'ok' | 'error'; text: string } | null>(null);
  async function change(next: boolean) {
    setOn(next); // show the choice at once; put it back if the server refuses
    setBusy(true);
    setMessage(null);
    try {
      const res = await apiFetch<Record<Field, boolean>>('/api/me', {
        method: 'PATCH',
        json: { [choice.field]: next },
      });
      setOn(res[choice.field]);
      setMessage({ kind: 'ok', text: res[choice.field] ? choice.onText : choice.offText });
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
    <div className="flex flex-col gap-1">
      <label className="flex items-center gap-2">
        <input type="checkbox" checked={on} disabled={busy} onChange={(e) => void change(e.target.checked)} />
        <span>{choice.label}</span>
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
