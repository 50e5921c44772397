import { useState, type FormEvent } from 'react';
import useSWR from 'swr';
import { apiFetch, ApiError, fetcher } from '~/lib/client/api';
import type { Role } from '~/lib/domain';
import { ROLE_LABELS } from '~/lib/policy';
import { RoleOptions, SubsystemChecks } from './pickers';

interface Invitation {
  id: string;
  email: string;
  name: string;
  role: Role;
  subsystems: string[];
  status: 'pending' | 'accepted' | 'expired' | 'revoked';
  invitedBy: string | null;
  createdAt: string;
  expiresAt: string;
  mail: { status: string; error: string | null; sentAt: string } | null;
}

interface Props {
  subsystems: { slug: string; name: string }[];
  season: string | null;
  capturing: boolean;
  initial: Invitation[];
}

const STATUS_LABEL: Record<Invitation['status'], string> = {
  pending: 'Pending',
  accepted: 'Accepted',
  expired: 'Expired',
  revoked: 'Revoked',
};
const day = (iso: string) => iso.slice(0, 10);

/** Invite by e-mail, and resend or revoke what is still pending. */
export default function Invitations({ subsystems, season, capturing, initial }: Props) {
  const { data, mutate } = useSWR<{ invitations: Invitation[] }>('/api/invitations', fetcher, {
    fallbackData: { invitations: initial },
    revalidateOnMount: false,
  });
  const [notice, setNotice] = useState<{ kind: 'ok' | 'error'; text: string } | null>(null);
  const list = data?.invitations ?? [];
  const names = new Map(subsystems.map((s) => [s.slug, s.name]));

  function mailNote(status: string): string {
    if (status === 'failed') return 'but the e-mail could not be sent; check the SMTP settings and resend it';
    return capturing ? 'the e-mail is in the outbox' : 'the e-mail was sent';
  }

  async function act(inv: Invitation, action: 'resend' | 'revoke') {
    setNotice(null);
    if (
      action === 'revoke' &&
      !window.confirm(`Revoke the invitation for ${inv.email}? Its link stops working at once.`)
    )
      return;
    try {
      const res = await apiFetch<{ mail?: { status: string } }>(`/api/invitations/${inv.id}/${action}`, {
        method: 'POST',
        json: {},
      });
      setNotice({
        kind: res.mail?.status === 'failed' ? 'error' : 'ok',
        text:
          action === 'resend'
            ? `A new link went to ${inv.email}; ${mailNote(res.mail?.status ?? '')}. The old link no longer works.`
            : `The invitation for ${inv.email} was revoked.`,
      });
      await mutate();
    } catch (err) {
      setNotice({
        kind: 'error',
        text: err instanceof ApiError ? err.message : 'Could not reach the server; try again.',
      });
    }
  }

  return (
    <div className="flex flex-col gap-8">
      <InviteForm
        subsystems={subsystems}
        season={season}
        // A new attempt clears the line about the last one, so a failure never sits under an earlier success.
        onStart={() => setNotice(null)}
        onInvited={async (inv, mailStatus) => {
          setNotice({
            kind: mailStatus === 'failed' ? 'error' : 'ok',
            text: `${inv.name} was invited as ${ROLE_LABELS[inv.role].toLowerCase()}; ${mailNote(mailStatus)}.`,
          });
          await mutate();
        }}
      />
      <div aria-live="polite">
        {notice && (
          <p
            role={notice.kind === 'error' ? 'alert' : 'status'}
            className={notice.kind === 'error' ? 'alert' : 'notice'}
          >
            {notice.text}
          </p>
        )}
      </div>
      <section aria-labelledby="inv-list-h">
        <h2 id="inv-list-h" className="mb-3 text-xl font-semibold">
          Pending and recent invitations
        </h2>
        {list.length === 0 ? (
          <p className="empty">No invitations in the last 30 days.</p>
        ) : (
          <div className="relative overflow-x-auto">
            <table className="w-full border-collapse text-sm">
              <caption className="sr-only">Invitations, newest first</caption>
              <thead>
                <tr className="border-b border-line text-left text-muted">
                  <th scope="col" className="py-2 pr-3">
                    Person
                  </th>
                  <th scope="col" className="py-2 pr-3">
                    Role
                  </th>
                  <th scope="col" className="py-2 pr-3">
                    Status
                  </th>
                  <th scope="col" className="py-2 pr-3">
                    E-mail
                  </th>
                  <th scope="col" className="py-2 pr-3">
                    Invited
                  </th>
                  <th scope="col" className="py-2">
                    <span className="sr-only">Actions</span>
                  </th>
                </tr>
              </thead>
              <tbody>
                {list.map((inv) => (
                  <tr key={inv.id} className="border-b border-line align-top">
                    <th scope="row" className="py-2 pr-3 text-left font-normal">
                      <strong>{inv.name}</strong>
                      <br />
                      <span className="break-all text-muted">{inv.email}</span>
                    </th>
                    <td className="py-2 pr-3">
                      {ROLE_LABELS[inv.role]}
                      {inv.subsystems.length > 0 && (
                        <>
                          <br />
                          <span className="text-muted">{inv.subsystems.map((s) => names.get(s) ?? s).join(', ')}</span>
                        </>
                      )}
                    </td>
                    <td className="py-2 pr-3">
                      {STATUS_LABEL[inv.status]}
                      {inv.status === 'pending' && (
                        <>
                          <br />
                          <span className="text-muted">until {day(inv.expiresAt)}</span>
                        </>
                      )}
                    </td>
                    <td className="py-2 pr-3">
                      {inv.mail ? (
                        inv.mail.status === 'failed' ? (
                          <span className="text-danger" title={inv.mail.error ?? ''}>
                            ✗ not sent
                          </span>
                        ) : inv.mail.status === 'captured' ? (
                          'in the outbox'
                        ) : (
                          '✓ sent'
                        )
                      ) : (
                        '–'
                      )}
                    </td>
                    <td className="py-2 pr-3 tabular">
                      {day(inv.createdAt)}
                      {inv.invitedBy && (
                        <>
                          <br />
                          <span className="text-muted">by {inv.invitedBy}</span>
                        </>
                      )}
                    </td>
                    <td className="py-2">
                      {(inv.status === 'pending' || inv.status === 'expired') && (
                        <span className="flex flex-wrap gap-2">
                          <button
                            type="button"
                            className="btn btn-quiet text-sm"
                            onClick={() => act(inv, 'resend')}
                            aria-label={`Resend the invitation to ${inv.email}`}
                          >
                            Resend
                          </button>
                          <button
                            type="button"
                            className="btn btn-quiet text-sm"
                            onClick={() => act(inv, 'revoke')}
                            aria-label={`Revoke the invitation to ${inv.email}`}
                          >
                            Revoke
                          </button>
                        </span>
                      )}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </section>
    </div>
  );
}

function InviteForm({
  subsystems,
  season,
  onStart,
  onInvited,
}: {
  subsystems: Props['subsystems'];
  season: string | null;
  onStart: () => void;
  onInvited: (inv: Invitation, mailStatus: string) => Promise<void>;
}) {
  const [email, setEmail] = useState('');
  const [name, setName] = useState('');
  const [role, setRole] = useState<Role>('member');
  const [owned, setOwned] = useState<string[]>([]);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [formError, setFormError] = useState('');
  const [busy, setBusy] = useState(false);

  async function submit(e: FormEvent) {
    e.preventDefault();
    onStart();
    setBusy(true);
    setErrors({});
    setFormError('');
    try {
      const res = await apiFetch<{ invitation: Invitation; mail: { status: string } }>('/api/invitations', {
        method: 'POST',
        json: { email, name, role, subsystems: owned },
      });
      setEmail('');
      setName('');
      setOwned([]);
      await onInvited(res.invitation, res.mail.status);
    } catch (err) {
      if (err instanceof ApiError) {
        const fields = err.fieldErrors();
        setErrors(fields);
        if (Object.keys(fields).length === 0) setFormError(err.message);
      } else setFormError('Could not reach the server; nothing was sent.');
    } finally {
      setBusy(false);
    }
  }

  const field = (id: string) => ({
    'aria-invalid': errors[id] ? true : undefined,
    'aria-describedby': errors[id] ? `inv-${id}-error` : undefined,
  });
  return (
    <form onSubmit={submit} className="card flex max-w-2xl flex-col gap-4" noValidate aria-labelledby="inv-form-h">
      <h2 id="inv-form-h" className="text-xl font-semibold">
        Invite someone
      </h2>
      {formError && (
        <p className="alert" role="alert">
          {formError}
        </p>
      )}
      <div className="grid gap-4 sm:grid-cols-2">
        <div className="field">
          <label htmlFor="inv-email">E-mail</label>
          <input
            id="inv-email"
            className="input"
            type="email"
            autoComplete="off"
            value={email}
            onChange={(e) => setEmail(e.target.value)}
            {...field('email')}
          />
          {errors.email && (
            <p id="inv-email-error" className="field-error">
              {errors.email}
            </p>
          )}
        </div>
        <div className="field">
          <label htmlFor="inv-name">Name</label>
          <input
            id="inv-name"
            className="input"
            type="text"
            autoComplete="off"
            value={name}
            onChange={(e) => setName(e.target.value)}
            {...field('name')}
          />
          {errors.name && (
            <p id="inv-name-error" className="field-error">
              {errors.name}
            </p>
          )}
        </div>
        <div className="field">
          <label htmlFor="inv-role">Role</label>
          <select
            id="inv-role"
            className="input"
            value={role}
            onChange={(e) => setRole(e.target.value as Role)}
            {...field('role')}
          >
            <RoleOptions />
          </select>
          {errors.role && (
            <p id="inv-role-error" className="field-error">
              {errors.role}
            </p>
          )}
        </div>
      </div>
      {season && (
        <fieldset>
          <legend className="mb-1 text-sm font-semibold">
            Subsystems they will own in {season} <span className="font-normal text-muted">(optional)</span>
          </legend>
          <SubsystemChecks
            subsystems={subsystems}
            owned={owned}
            onChange={setOwned}
            className="grid grid-cols-2 gap-x-4 gap-y-1 text-sm sm:grid-cols-4"
          />
          {errors.subsystems && <p className="field-error">{errors.subsystems}</p>}
        </fieldset>
      )}
      <p className="text-sm text-muted">
        They get an e-mail with a link that works once, for 7 days, to choose a password.
      </p>
      <button type="submit" className="btn btn-primary self-start" disabled={busy}>
        {busy ? 'Sending…' : 'Send the invitation'}
      </button>
    </form>
  );
}
