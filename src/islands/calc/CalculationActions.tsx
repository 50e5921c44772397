import { useState, type FormEvent } from 'react';
import { apiFetch, ApiError } from '~/lib/client/api';
import SubsystemSelect from '../ui/SubsystemSelect';

interface Option {
  id: string;
  title: string;
  note: string;
}

/** Rename, re-note, move or delete a saved calculation, and link it to a record (through the record's own route). */
export default function CalculationActions({
  id,
  title,
  notes,
  subsystem,
  subsystems,
  canEdit,
  records,
}: {
  id: string;
  title: string;
  notes: string;
  subsystem: string;
  subsystems: { slug: string; name: string }[];
  canEdit: boolean;
  /** Records the person may link it to (none: no link form). */
  records: Option[];
}) {
  return (
    <div className="flex flex-col gap-4">
      {canEdit && <EditForm id={id} title={title} notes={notes} subsystem={subsystem} subsystems={subsystems} />}
      {records.length > 0 && <LinkForm id={id} records={records} />}
      {canEdit && <DeleteButton id={id} title={title} />}
    </div>
  );
}

function EditForm({
  id,
  title,
  notes,
  subsystem,
  subsystems,
}: {
  id: string;
  title: string;
  notes: string;
  subsystem: string;
  subsystems: { slug: string; name: string }[];
}) {
  const [open, setOpen] = useState(false);
  const [values, setValues] = useState({ title, notes, subsystem });
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState('');
  const [busy, setBusy] = useState(false);

  async function save(e: FormEvent) {
    e.preventDefault();
    setBusy(true);
    setErrors({});
    setMessage('');
    try {
      await apiFetch(`/api/calculations/${id}`, { method: 'PATCH', json: values });
      window.location.reload();
    } catch (err) {
      setBusy(false);
      if (err instanceof ApiError) {
        setErrors(err.fieldErrors());
        setMessage(err.message);
      } else setMessage('Could not reach the server. Your changes are still here; try again.');
    }
  }

  if (!open)
    return (
      <button type="button" className="btn btn-quiet justify-center" onClick={() => setOpen(true)}>
        Rename, edit notes or move
      </button>
    );
  return (
    <form onSubmit={save} className="flex flex-col gap-3" aria-label="Edit this calculation" noValidate>
      {message && (
        <p className="alert" role="alert">
          {message}
        </p>
      )}
      <div className="field">
        <label htmlFor="edit-title">Title</label>
        <input
          id="edit-title"
          className="input"
          value={values.title}
          onChange={(e) => setValues((v) => ({ ...v, title: e.target.value }))}
          aria-invalid={errors.title ? true : undefined}
          aria-describedby={errors.title ? 'edit-title-error' : undefined}
        />
        {errors.title && (
          <p id="edit-title-error" className="field-error">
            {errors.title}
          </p>
        )}
      </div>
      <SubsystemSelect
        id="edit-subsystem"
        value={values.subsystem}
        onChange={(subsystem) => setValues((v) => ({ ...v, subsystem }))}
        subsystems={subsystems}
        error={errors.subsystem}
      />
      <div className="field">
        <label htmlFor="edit-notes">Notes</label>
        <textarea
          id="edit-notes"
          className="input min-h-24"
          value={values.notes}
          onChange={(e) => setValues((v) => ({ ...v, notes: e.target.value }))}
        />
        {errors.notes && <p className="field-error">{errors.notes}</p>}
      </div>
      <div className="flex flex-wrap gap-2">
        <button type="submit" className="btn btn-primary" disabled={busy}>
          {busy ? 'Saving…' : 'Save changes'}
        </button>
        <button type="button" className="btn btn-quiet" onClick={() => setOpen(false)}>
          Cancel
        </button>
      </div>
    </form>
  );
}

interface RecordBody {
  record: { version: number; calculations: { id: string }[]; url?: string };
}

function LinkForm({ id, records }: { id: string; records: Option[] }) {
  const [recordId, setRecordId] = useState(records[0]?.id ?? '');
  const [message, setMessage] = useState('');
  const [linked, setLinked] = useState<Option | null>(null);
  const [busy, setBusy] = useState(false);

  // Adds this calculation to the record's links with the record's current version; one retry if someone saved
  // the record in between.
  async function link(e: FormEvent) {
    e.preventDefault();
    setBusy(true);
    setMessage('');
    try {
      for (let attempt = 0; ; attempt++) {
        const { record } = await apiFetch<RecordBody>(`/api/records/${recordId}`);
        const ids = [...new Set([...record.calculations.map((c) => c.id), id])];
        try {
          await apiFetch(`/api/records/${recordId}`, {
            method: 'PATCH',
            json: { version: record.version, calculationIds: ids },
          });
          break;
        } catch (err) {
          if (err instanceof ApiError && err.status === 409 && attempt === 0) continue;
          throw err;
        }
      }
      setLinked(records.find((r) => r.id === recordId) ?? null);
    } catch (err) {
      setMessage(err instanceof ApiError ? err.message : 'Could not reach the server; try again.');
    } finally {
      setBusy(false);
    }
  }

  return (
    <form onSubmit={link} className="flex flex-col gap-2" aria-label="Link to a record">
      <div className="field">
        <label htmlFor="link-record">Link to a record</label>
        <select id="link-record" className="input" value={recordId} onChange={(e) => setRecordId(e.target.value)}>
          {records.map((r) => (
            <option key={r.id} value={r.id}>
              {r.title} ({r.note})
            </option>
          ))}
        </select>
      </div>
      <button type="submit" className="btn btn-quiet justify-center" disabled={busy}>
        {busy ? 'Linking…' : 'Add to that record’s calculations'}
      </button>
      <div aria-live="polite">
        {message && <p className="alert">{message}</p>}
        {linked && (
          <p className="text-sm">
            Linked to <a href={`/records/${linked.id}`}>{linked.title}</a>.
          </p>
        )}
      </div>
    </form>
  );
}

function DeleteButton({ id, title }: { id: string; title: string }) {
  const [confirming, setConfirming] = useState(false);
  const [message, setMessage] = useState('');
  const [busy, setBusy] = useState(false);

  async function remove() {
    setBusy(true);
    setMessage('');
    try {
      await apiFetch(`/api/calculations/${id}`, { method: 'DELETE' });
      window.location.assign('/calculations');
    } catch (err) {
      setBusy(false);
      setMessage(err instanceof ApiError ? err.message : 'Could not reach the server; try again.');
    }
  }

  return (
    <div className="flex flex-col gap-2">
      {!confirming ? (
        <button type="button" className="btn btn-quiet justify-center" onClick={() => setConfirming(true)}>
          Delete this calculation…
        </button>
      ) : (
        <div
          className="flex flex-col gap-2 rounded-lg border border-danger p-3"
          role="group"
          aria-label="Confirm delete"
        >
          <p>
            Delete “{title}”? It leaves lists, search and the records that link it. This cannot be undone from Wakebook.
          </p>
          <div className="flex flex-wrap gap-2">
            <button type="button" className="btn btn-danger" onClick={remove} disabled={busy}>
              {busy ? 'Deleting…' : 'Delete'}
            </button>
            <button type="button" className="btn btn-quiet" onClick={() => setConfirming(false)}>
              Keep it
            </button>
          </div>
        </div>
      )}
      <div aria-live="polite">{message && <p className="alert">{message}</p>}</div>
    </div>
  );
}
