import { useState, type FormEvent } from 'react';
import { apiFetch, ApiError } from '~/lib/client/api';
import { MIN_PASSWORD_LENGTH } from '~/lib/password-rules';

type Field = 'currentPassword' | 'newPassword' | 'repeat';

/** Changes the signed-in person's password; the server checks the current one and the strength rules. */
export default function PasswordChange() {
  const [values, setValues] = useState<Record<Field, string>>({ currentPassword: '', newPassword: '', repeat: '' });
  const [errors, setErrors] = useState<Partial<Record<Field, string>>>({});
  const [message, setMessage] = useState<{ kind: 'ok' | 'error'; text: string } | null>(null);
  const [busy, setBusy] = useState(false);
  const set = (k: Field, v: string) => setValues((x) => ({ ...x, [k]: v }));

  async function submit(e: FormEvent) {
    e.preventDefault();
    setMessage(null);
    if (values.newPassword !== values.repeat) {
      setErrors({ repeat: 'The two new passwords differ; type the new one again.' });
      return;
    }
    setBusy(true);
    setErrors({});
    try {
      await apiFetch('/api/account/password', {
        method: 'POST',
        json: { currentPassword: values.currentPassword, newPassword: values.newPassword },
      });
      setValues({ currentPassword: '', newPassword: '', repeat: '' });
      setMessage({
        kind: 'ok',
        text: 'Password changed. You stay signed in here; every other device was signed out. A confirmation e-mail is on its way.',
      });
    } catch (err) {
      if (err instanceof ApiError) {
        setErrors(err.fieldErrors());
        setMessage({
          kind: 'error',
          text:
            err.status === 400
              ? 'The password was not changed: see the message under the field concerned.'
              : err.message,
        });
      } else setMessage({ kind: 'error', text: 'Could not reach the server; the password was not changed.' });
    } finally {
      setBusy(false);
    }
  }

  const field = (id: Field, label: string, autoComplete: string, hint?: string) => (
    <div className="field">
      <label htmlFor={`pw-${id}`}>{label}</label>
      <input
        id={`pw-${id}`}
        type="password"
        className="input"
        autoComplete={autoComplete}
        value={values[id]}
        onChange={(e) => set(id, e.target.value)}
        required
        aria-invalid={errors[id] ? true : undefined}
        aria-describedby={
          [hint ? `pw-${id}-hint` : '', errors[id] ? `pw-${id}-error` : ''].join(' ').trim() || undefined
        }
      />
      {hint && (
        <p id={`pw-${id}-hint`} className="text-sm text-muted">
          {hint}
        </p>
      )}
      {errors[id] && (
        <p id={`pw-${id}-error`} className="field-error">
          {errors[id]}
        </p>
      )}
    </div>
  );

  return (
    <form className="flex flex-col gap-4" onSubmit={submit} noValidate aria-label="Change your password">
      {field('currentPassword', 'Current password', 'current-password')}
      {field(
        'newPassword',
        'New password',
        'new-password',
        `At least ${MIN_PASSWORD_LENGTH} characters. A few unrelated words work well; common passwords are refused.`,
      )}
      {field('repeat', 'New password again', 'new-password')}
      <div>
        <button type="submit" className="btn btn-primary" disabled={busy}>
          {busy ? 'Changing…' : 'Change password'}
        </button>
      </div>
      <div aria-live="polite">
        {message && (
          <p
            role={message.kind === 'error' ? 'alert' : 'status'}
            className={message.kind === 'error' ? 'alert' : 'rounded bg-accent-soft px-3 py-2 text-sm'}
          >
            {message.text}
          </p>
        )}
      </div>
    </form>
  );
}
