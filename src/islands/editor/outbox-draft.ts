import { useEffect, useState } from 'react';
import type { Editor, JSONContent } from '@tiptap/react';
import { apiFetch } from '~/lib/client/api';

/** The body of a kept record edit (the PATCH the editor sent). */
export interface KeptEditBody {
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

export interface KeptEdit {
  entryId: string;
  edit: KeptEditBody;
  /** The record as the server has it now. */
  current: { version: number; title: string; body: JSONContent; updatedBy: string | null };
}

/**
 * `/records/<id>/edit?outbox=<entryId>`: the edit kept in the outbox that met a newer version on the server. Loads
 * it once the editor exists, with the server's current record, so the editor can open the same merge view as a
 * conflict met online.
 */
export function useOutboxDraft(
  recordId: string | undefined,
  editor: Editor | null,
  onLoad: (kept: KeptEdit) => void,
): string | null {
  const [entryId, setEntryId] = useState<string | null>(null);
  const wanted = recordId ? new URLSearchParams(window.location.search).get('outbox') : null;
  useEffect(() => {
    if (!wanted || !recordId || !editor) return;
    let live = true;
    void (async () => {
      // Loaded only here: editing pages without a kept change do not carry the outbox's IndexedDB code.
      const { getChange, recordOf } = await import('~/lib/client/outbox');
      const entry = await getChange(wanted);
      if (!entry || recordOf(entry) !== recordId) return;
      const res = await apiFetch<{
        record: { version: number; title: string; body: JSONContent; updatedBy: { name: string } | null };
      }>(`/api/records/${encodeURIComponent(recordId)}`);
      if (!live) return;
      const r = res.record;
      setEntryId(entry.id);
      onLoad({
        entryId: entry.id,
        edit: entry.body as KeptEditBody,
        current: { version: r.version, title: r.title, body: r.body, updatedBy: r.updatedBy?.name ?? null },
      });
    })();
    return () => {
      live = false;
    };
    // Once per editor: the entry named in the address does not change while the page lives.
    // eslint-disable-next-line react-hooks/exhaustive-deps -- onLoad is a fresh closure each render
  }, [wanted, recordId, editor]);
  return entryId;
}

/** The kept edit is saved now: it leaves the outbox. */
export async function dropKeptEdit(entryId: string): Promise<void> {
  const { discardChange } = await import('~/lib/client/outbox');
  await discardChange(entryId);
}
