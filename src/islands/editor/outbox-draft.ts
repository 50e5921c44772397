// Loaded by the record editor only for `/records/<id>/edit?outbox=<entryId>`: the edit kept in the outbox that met a
// newer version on the server goes into the editor as "mine", beside the server's current record, so the person
// resolves it in the same merge view as a conflict met online. Kept out of the editor's own chunk (and the outbox's
// IndexedDB code with it), so editing pages without a kept change do not carry it.
import type { Editor, JSONContent } from '@tiptap/react';
import { apiFetch } from '~/lib/client/api';
import { getChange, recordOf } from '~/lib/client/outbox';

/** The body of a kept record edit (the PATCH the editor sent). */
interface KeptEditBody {
  version: number;
  title?: string;
  subsystem?: string;
  seasonId?: string;
  source?: string;
  body: JSONContent;
  calculationIds?: string[];
  relatedRecordIds?: string[];
  changeNote?: string;
}

interface Conflict {
  version: number;
  title: string;
  body: JSONContent;
  updatedBy: string | null;
}

/** The editor's state setters this needs. */
export interface EditorState<F> {
  setFields: (f: (old: F) => F) => void;
  setBodyJson: (b: JSONContent) => void;
  setVersion: (v: number) => void;
  setChangeNote: (n: string) => void;
  setConflict: (c: Conflict) => void;
  setMessage: (m: { tone: 'ok' | 'error'; text: string }) => void;
  setFromOutbox: (id: string) => void;
  setRestorable: (d: null) => void;
}

export async function loadKeptEdit<F>(recordId: string, entryId: string, editor: Editor, s: EditorState<F>) {
  const entry = await getChange(entryId);
  if (!entry || recordOf(entry) !== recordId) return;
  const res = await apiFetch<{
    record: { version: number; title: string; body: JSONContent; updatedBy: { name: string } | null };
  }>(`/api/records/${encodeURIComponent(recordId)}`);
  const current = res.record;
  const { version: base, body, changeNote, ...kept } = entry.body as KeptEditBody;
  s.setFields((f) => ({ ...f, ...kept }));
  editor.commands.setContent(body);
  s.setBodyJson(body);
  s.setVersion(base);
  s.setChangeNote(changeNote ?? '');
  s.setFromOutbox(entry.id);
  s.setRestorable(null); // the kept change stands in for any older local draft
  if (current.version === base) {
    s.setMessage({ tone: 'ok', text: 'Your change kept on this device is in the editor. Save to send it.' });
    return;
  }
  s.setConflict({ ...current, updatedBy: current.updatedBy?.name ?? null });
  s.setMessage({
    tone: 'error',
    text: `Your change kept on this device was made on version ${base}; version ${current.version} was saved meanwhile. Choose per section below, then save.`,
  });
}
