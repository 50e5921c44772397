import { useState, type FormEvent } from 'react';
import { apiFetch, ApiError } from '~/lib/client/api';
import type { Role } from '~/lib/domain';
import { RoleOptions, SubsystemChecks } from './pickers';

interface Props {
  id: string;
  name: string;
  role: Role;
  /** Subsystems this person owns in the current season. */
  owned: string[];
  subsystems: { slug: string; name: string }[];
  season: string | null;
  isSelf: boolean;
}

/** A lead's controls for one person: role, and who owns what in the current season. */
export default function PersonEditor({
  id,
  name,
  role: initialRole,
  owned: initialOwned,
  subsystems,
  season,
  isSelf,
}: Props) {
  const [open, setOpen] = useState(false);
  const [role, setRole] = useState<Role>(initialRole);
  const [owned, setOwned] = useState<string[]>(initialOwned);
  const [saved, setSaved] = useState({ role: initialRole, owned: initialOwned });
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<{ kind: 'ok' | 'error'; text: string } | null>(null);
  const base = `person-${id}`;
  const changed = role !== saved.role || owned.slice().sort().join() !== saved.owned.slice().sort().join();

  async function save(e: FormEvent) {
    e.preventDefault();
    setBusy(true);
    setMessage(null);
    try {
      const body: { role?: Role; subsystems?: string[] } = {};
      if (role !== saved.role) body.role = role;
      if (season && owned.slice().sort().join() !== saved.owned.slice().sort().join()) body.subsystems = owned;
      await apiFetch(`/api/people/${id}`, { method: 'PATCH', json: body });
      setSaved({ role, owned });
      setMessage({ kind: 'ok', text: 'Saved.' });
      if (isSelf && body.role && body.role !== 'lead') window.location.assign('/');
    } catch (err) {
      const text = err instanceof ApiError ? err.message : 'Could not reach the server; nothing was changed.';
      setMessage({ kind: 'error', text });
      if (err instanceof ApiError && err.status === 409) setRole(saved.role);
    } finally {
      setBusy(false);
    }
  }

  if (!open) {
    return (
      <button
        type="button"
        className="btn btn-quiet text-sm"
        onClick={() => setOpen(true)}
        aria-label={`Change ${name}`}
      >
        Change
      </button>
    );
  }
  return (
    <form
      onSubmit={save}
      className="flex min-w-56 flex-col gap-2 rounded-md border border-line bg-surface p-3 text-sm"
      aria-label={`Change ${name}`}
    >
      <div className="field">
        <label htmlFor={`${base}-role`}>Role</label>
        <select
          id={`${base}-role`}
          className="input py-1 text-sm"
          value={role}
          onChange={(e) => setRole(e.target.value as Role)}
        >
          <RoleOptions />
        </select>
      </div>
      {season ? (
        <fieldset>
          <legend className="mb-1 font-semibold">Owns in {season}</legend>
          <SubsystemChecks
            subsystems={subsystems}
            owned={owned}
            onChange={setOwned}
            className="grid grid-cols-2 gap-x-3 gap-y-1"
          />
        </fieldset>
      ) : (
        <p className="text-muted">No season is current, so there is nothing to assign.</p>
      )}
      <div className="flex gap-2">
        <button type="submit" className="btn btn-primary text-sm" disabled={busy || !changed}>
          {busy ? 'Saving…' : 'Save'}
        </button>
        <button
          type="button"
          className="btn btn-quiet text-sm"
          onClick={() => {
            setOpen(false);
            setRole(saved.role);
            setOwned(saved.owned);
            setMessage(null);
          }}
        >
          Close
        </button>
      </div>
      {message && (
        <p
          role={message.kind === 'error' ? 'alert' : 'status'}
          className={message.kind === 'error' ? 'field-error' : 'text-accent'}
        >
          {message.text}
        </p>
      )}
    </form>
  );
}
