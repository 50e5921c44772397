import { useState } from 'react';
import { apiFetch, ApiError } from '~/lib/client/api';

/** Sends one reminder e-mail to carry on with onboarding; says what happened to the mail. */
export default function NudgeButton({ userId, name }: { userId: string; name: string }) {
  const [state, setState] = useState<'idle' | 'busy' | 'done' | 'error'>('idle');
  const [text, setText] = useState('');
  async function nudge() {
    setState('busy');
    try {
      const res = await apiFetch<{ mail: { status: string } }>(`/api/people/${userId}/nudge`, {
        method: 'POST',
        json: {},
      });
      if (res.mail.status === 'failed') {
        setState('error');
        setText('The e-mail could not be sent; see the outbox.');
      } else {
        setState('done');
        setText(res.mail.status === 'captured' ? 'Reminder captured in the outbox.' : 'Reminder sent.');
      }
    } catch (e) {
      setState('error');
      setText(e instanceof ApiError ? e.message : 'Could not reach the server; try again.');
    }
  }
  return (
    <span className="inline-flex flex-wrap items-center gap-2">
      <button
        type="button"
        className="btn btn-quiet px-2 py-0.5 text-xs"
        onClick={nudge}
        disabled={state === 'busy'}
        aria-label={`Nudge ${name}: e-mail a reminder to carry on with onboarding`}
      >
        {state === 'busy' ? 'Sending…' : 'Nudge'}
      </button>
      {text && (
        <span
          className={state === 'error' ? 'field-error text-xs' : 'text-xs text-muted'}
          role={state === 'error' ? 'alert' : 'status'}
        >
          {text}
        </span>
      )}
    </span>
  );
}
