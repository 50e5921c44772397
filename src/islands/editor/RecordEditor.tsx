import { lazy, Suspense, useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { EditorContent, useEditor, type JSONContent } from '@tiptap/react';
import useSWR from 'swr';
import { recordExtensions } from '~/lib/editor/extensions';
import { templateFor, withSectionSlots } from '~/lib/editor/templates';
import { SectionPrompts } from '~/lib/editor/section-prompts';
import { MAX_CHANGE_NOTE } from '~/lib/record-rules';
import { apiFetch, ApiError, fetcher, KeptOnDevice } from '~/lib/client/api';
import { LESSON_SOURCES, type LessonSource, type RecordKind } from '~/lib/domain';
import Toolbar from './Toolbar';
import LinkPicker, { type PickOption } from './LinkPicker';
import { draftKey, readDraft, writeDraft, clearDraft, type Draft } from './drafts';
import SubsystemSelect from '../ui/SubsystemSelect';

// The merge view (and the word diff it needs) loads only when a save meets a newer version.
const ConflictView = lazy(() => import('./ConflictView'));

export interface EditableRecord {
  id: string;
  version: number;
  kind: RecordKind;
  title: string;
  subsystem: string;
  seasonId: string;
  source: string | null;
  body: JSONContent;
  calculationIds: string[];
  relatedRecordIds: string[];
}

interface Props {
  record?: EditableRecord;
  kind?: RecordKind;
  subsystems: { slug: string; name: string }[];
  seasons: { id: string; name: string; current: boolean }[];
  canPickSeason: boolean;
  defaultSubsystem?: string;
}

interface Fields {
  title: string;
  subsystem: string;
  seasonId: string;
  source: string;
  calculationIds: string[];
  relatedRecordIds: string[];
}

interface Conflict {
  version: number;
  title: string;
  body: JSONContent;
  updatedBy: string | null;
}

const SOURCE_LABELS: Record<LessonSource, string> = {
  testing: 'Testing',
  building: 'Building',
  racing: 'Racing',
  organising: 'Organising',
};

export default function RecordEditor({
  record,
  kind: newKind,
  subsystems,
  seasons,
  canPickSeason,
  defaultSubsystem,
}: Props) {
  const kind = record?.kind ?? newKind ?? 'decision';
  const key = draftKey(record?.id, kind);
  const currentSeason = seasons.find((s) => s.current)?.id ?? seasons[0]?.id ?? '';
  const initialFields: Fields = {
    title: record?.title ?? '',
    subsystem: record?.subsystem ?? defaultSubsystem ?? subsystems[0]?.slug ?? '',
    seasonId: record?.seasonId ?? currentSeason,
    source: record?.source ?? (kind === 'lesson' ? 'testing' : ''),
    calculationIds: record?.calculationIds ?? [],
    relatedRecordIds: record?.relatedRecordIds ?? [],
  };
  // Empty sections get a paragraph to hold their prompt; the prompts themselves are decorations, never text.
  const initialBody = record ? withSectionSlots(record.body) : templateFor(kind);
  const [fields, setFields] = useState<Fields>(initialFields);
  const [version, setVersion] = useState(record?.version ?? 0);
  const [saved, setSaved] = useState(() => JSON.stringify({ fields: initialFields, body: initialBody }));
  const [bodyJson, setBodyJson] = useState<JSONContent>(initialBody);
  // Offer a local draft that differs from what the server has. The island renders only in the browser
  // (`client:only`), so the draft is read once, as it mounts; key and record do not change while it lives.
  const [restorable, setRestorable] = useState<Draft | null>(() => {
    const d = readDraft(key);
    return d && JSON.stringify({ fields: d.fields, body: d.body }) !== saved ? d : null;
  });
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<{ tone: 'ok' | 'error'; text: string } | null>(null);
  const [saving, setSaving] = useState(false);
  const [changeNote, setChangeNote] = useState('');
  const [conflict, setConflict] = useState<Conflict | null>(null);
  const [kept, setKept] = useState(false);
  const leaving = useRef(false);

  const extensions = useMemo(() => [...recordExtensions(), SectionPrompts], []);
  const editor = useEditor({
    extensions,
    content: initialBody,
    immediatelyRender: false,
    editorProps: {
      attributes: {
        class: 'prose-wb min-h-[24rem] px-4 py-3',
        'aria-label': 'Record text',
        role: 'textbox',
        'aria-multiline': 'true',
      },
    },
    onUpdate: ({ editor: e }) => setBodyJson(e.getJSON()),
  });

  const dirty = JSON.stringify({ fields, body: bodyJson }) !== saved;

  // `?outbox=<entry>`: an edit kept offline that met a newer version, loaded as "mine" into the merge view.
  const [fromOutbox, setFromOutbox] = useState<string | null>(null);
  useEffect(() => {
    const entryId = new URLSearchParams(window.location.search).get('outbox');
    if (!record || !editor || !entryId) return;
    void import('./outbox-draft').then((m) =>
      m.loadKeptEdit(record.id, entryId, editor, {
        setFields,
        setBodyJson,
        setVersion,
        setChangeNote,
        setConflict,
        setMessage,
        setFromOutbox,
        setRestorable,
      }),
    );
  }, [record, editor]);

  // Keep unsaved work in this browser, so a reload or a crash loses nothing.
  useEffect(() => {
    if (!dirty) return;
    const t = window.setTimeout(
      () => writeDraft(key, { fields, body: bodyJson, baseVersion: version, savedAt: new Date().toISOString() }),
      400,
    );
    return () => window.clearTimeout(t);
  }, [dirty, fields, bodyJson, key, version]);

  useEffect(() => {
    const warn = (e: BeforeUnloadEvent) => {
      if (dirty && !leaving.current) {
        e.preventDefault();
        e.returnValue = '';
      }
    };
    window.addEventListener('beforeunload', warn);
    return () => window.removeEventListener('beforeunload', warn);
  }, [dirty]);

  const calcs = useSWR<{
    calculations: {
      id: string;
      title: string;
      kind: string;
      kindTitle?: string;
      season: string;
      subsystemName: string;
    }[];
  }>('/api/calculations?limit=100', fetcher);
  const recs = useSWR<{
    records: { id: string; title: string; kind: string; season: string; subsystemName: string }[];
  }>('/api/records?limit=100', fetcher);
  const calcOptions: PickOption[] = (calcs.data?.calculations ?? []).map((c) => ({
    id: c.id,
    title: c.title,
    detail: `${c.kindTitle ?? c.kind} · ${c.subsystemName} · ${c.season}`,
  }));
  const recOptions: PickOption[] = (recs.data?.records ?? [])
    .filter((r) => r.id !== record?.id)
    .map((r) => ({
      id: r.id,
      title: r.title,
      detail: `${r.kind === 'decision' ? 'decision' : 'lesson'} · ${r.subsystemName} · ${r.season}`,
    }));

  const set = <K extends keyof Fields>(k: K, v: Fields[K]) => setFields((f) => ({ ...f, [k]: v }));

  const restore = () => {
    if (!restorable) return;
    setFields(restorable.fields);
    editor?.commands.setContent(restorable.body);
    setBodyJson(restorable.body);
    setRestorable(null);
    setMessage({
      tone: 'ok',
      text: `Restored your unsaved changes from ${new Date(restorable.savedAt).toLocaleString()}. Save to keep them.`,
    });
  };

  const save = useCallback(
    async (overrideVersion?: number) => {
      if (!editor) return;
      setSaving(true);
      setErrors({});
      setMessage(null);
      const body = editor.getJSON();
      const payload = {
        title: fields.title,
        subsystem: fields.subsystem,
        ...(canPickSeason ? { seasonId: fields.seasonId } : {}),
        ...(kind === 'lesson' ? { source: fields.source || undefined } : {}),
        body,
        calculationIds: fields.calculationIds,
        relatedRecordIds: fields.relatedRecordIds,
      };
      try {
        if (!record) {
          const res = await apiFetch<{ record: { url: string } }>('/api/records', {
            method: 'POST',
            json: { kind, ...payload },
            offline: { label: newLabel(kind, fields.title) },
          });
          clearDraft(key);
          leaving.current = true;
          window.location.assign(res.record.url);
          return;
        }
        const res = await apiFetch<{ record: { version: number; url: string } }>(`/api/records/${record.id}`, {
          method: 'PATCH',
          json: {
            version: overrideVersion ?? version,
            ...payload,
            ...(changeNote.trim() ? { changeNote: changeNote.trim() } : {}),
          },
          offline: { label: `Edit of ‘${record.title}’` },
        });
        await dropKept(fromOutbox);
        setVersion(res.record.version);
        setChangeNote('');
        setSaved(JSON.stringify({ fields, body }));
        setBodyJson(body);
        clearDraft(key);
        setConflict(null);
        setMessage({ tone: 'ok', text: `Saved as version ${res.record.version}.` });
      } catch (e) {
        if (e instanceof KeptOnDevice) {
          // The outbox holds it now (and sends it when the network is back); the draft is no longer needed.
          clearDraft(key);
          await dropKept(fromOutbox);
          leaving.current = true;
          setKept(true); // sent later from the outbox; saving again here would send it twice
          setMessage({ tone: 'ok', text: e.message });
        } else if (e instanceof ApiError && e.status === 409 && e.body?.error.current) {
          const cur = e.body.error.current as {
            version: number;
            title: string;
            body: JSONContent;
            updatedBy: { name: string } | null;
          };
          setConflict({
            version: cur.version,
            title: cur.title,
            body: cur.body,
            updatedBy: cur.updatedBy?.name ?? null,
          });
          setMessage({
            tone: 'error',
            text: 'Not saved: someone else saved this record while you were editing. Your text is safe here; the sections that differ are below.',
          });
        } else if (e instanceof ApiError) {
          setErrors(e.fieldErrors());
          setMessage({
            tone: 'error',
            text:
              e.status === 401
                ? 'Your session ended. Sign in again in another tab, then save: your text is kept in this browser.'
                : e.message,
          });
        } else {
          setMessage({
            tone: 'error',
            text: 'Could not reach the server. Your text is kept in this browser; try again.',
          });
        }
      } finally {
        setSaving(false);
      }
    },
    [editor, fields, canPickSeason, kind, record, version, key, changeNote, fromOutbox],
  );

  // Ctrl/Cmd+S saves.
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      if ((e.ctrlKey || e.metaKey) && e.key.toLowerCase() === 's') {
        e.preventDefault();
        void save();
      }
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [save]);

  const takeTheirs = () => {
    if (!conflict || !editor) return;
    if (!window.confirm('Replace your text with theirs? Your version stays in this browser’s draft until you save.'))
      return;
    writeDraft(key, { fields, body: editor.getJSON(), baseVersion: version, savedAt: new Date().toISOString() });
    editor.commands.setContent(conflict.body);
    setFields((f) => ({ ...f, title: conflict.title }));
    setVersion(conflict.version);
    setBodyJson(conflict.body);
    setConflict(null);
    setMessage({ tone: 'ok', text: `Loaded version ${conflict.version}. Edit and save, or leave without saving.` });
  };

  const applyChoices = (result: { title: string; body: JSONContent }) => {
    if (!conflict || !editor) return;
    writeDraft(key, { fields, body: editor.getJSON(), baseVersion: version, savedAt: new Date().toISOString() });
    editor.commands.setContent(result.body);
    setBodyJson(result.body);
    setFields((f) => ({ ...f, title: result.title }));
    setVersion(conflict.version);
    setConflict(null);
    setMessage({
      tone: 'ok',
      text: 'Your choices are in the editor now, on top of their version. Check the text, then save.',
    });
  };

  const keepMine = () => {
    if (!conflict) return;
    void save(conflict.version);
  };

  if (!editor) return <p className="text-muted">Loading the editor…</p>;
  return (
    <form
      className="flex flex-col gap-5"
      onSubmit={(e) => {
        e.preventDefault();
        void save();
      }}
      noValidate
      aria-label={record ? 'Edit record' : 'New record'}
    >
      {restorable && (
        <div className="notice flex flex-wrap items-center gap-3" role="status">
          <span>You have unsaved changes from {new Date(restorable.savedAt).toLocaleString()} in this browser.</span>
          <button type="button" className="btn btn-primary" onClick={restore}>
            Restore them
          </button>
          <button
            type="button"
            className="btn btn-quiet"
            onClick={() => {
              clearDraft(key);
              setRestorable(null);
            }}
          >
            Discard
          </button>
        </div>
      )}
      {message && (
        <p
          className={message.tone === 'ok' ? 'rounded bg-accent-soft px-3 py-2 text-sm' : 'alert'}
          role={message.tone === 'ok' ? 'status' : 'alert'}
        >
          {message.text}
        </p>
      )}
      {conflict && (
        <Suspense fallback={<p className="text-sm text-muted">Opening the two versions side by side…</p>}>
          <ConflictView
            mine={{ title: fields.title, body: bodyJson }}
            theirs={conflict}
            onApply={applyChoices}
            onKeepMine={keepMine}
            onTakeTheirs={takeTheirs}
          />
        </Suspense>
      )}

      <div className="field">
        <label htmlFor="rec-title">Title</label>
        <input
          id="rec-title"
          className="input text-lg"
          value={fields.title}
          onChange={(e) => set('title', e.target.value)}
          placeholder={
            kind === 'decision'
              ? 'e.g. Run two propellers: sprint and endurance'
              : 'e.g. Controller derated in the endurance heat'
          }
          aria-invalid={errors.title ? true : undefined}
          aria-describedby={errors.title ? 'rec-title-error' : undefined}
        />
        {errors.title && (
          <p id="rec-title-error" className="field-error">
            {errors.title}
          </p>
        )}
      </div>
      <div className="grid gap-4 sm:grid-cols-3">
        <SubsystemSelect
          id="rec-subsystem"
          value={fields.subsystem}
          onChange={(v) => set('subsystem', v)}
          subsystems={subsystems}
          error={errors.subsystem}
        />
        <div className="field">
          <label htmlFor="rec-season">Season</label>
          <select
            id="rec-season"
            className="input"
            value={fields.seasonId}
            onChange={(e) => set('seasonId', e.target.value)}
            disabled={!canPickSeason}
          >
            {seasons.map((s) => (
              <option key={s.id} value={s.id}>
                {s.name}
                {s.current ? ' (current)' : ''}
              </option>
            ))}
          </select>
          {errors.seasonId && <p className="field-error">{errors.seasonId}</p>}
        </div>
        {kind === 'lesson' && (
          <div className="field">
            <label htmlFor="rec-source">Learned while</label>
            <select
              id="rec-source"
              className="input"
              value={fields.source}
              onChange={(e) => set('source', e.target.value)}
            >
              {LESSON_SOURCES.map((s) => (
                <option key={s} value={s}>
                  {SOURCE_LABELS[s]}
                </option>
              ))}
            </select>
          </div>
        )}
      </div>

      <div>
        <p id="body-label" className="mb-1 text-sm font-semibold">
          Text
        </p>
        <div
          className="editor-frame overflow-hidden rounded-lg border border-line bg-surface"
          aria-labelledby="body-label"
        >
          <Toolbar editor={editor} />
          <EditorContent editor={editor} />
        </div>
        {errors.body && <p className="field-error">{errors.body}</p>}
        <p className="mt-1 text-xs text-muted">
          Keep the section headings and write under each; the grey prompts are only hints and are never saved. Unsaved
          changes are kept in this browser. Ctrl+S saves.
        </p>
      </div>

      <div className="grid gap-6 md:grid-cols-2">
        <LinkPicker
          label="Linked calculations"
          options={calcOptions}
          selected={fields.calculationIds}
          onChange={(v) => set('calculationIds', v)}
          loading={calcs.isLoading}
          emptyText="No saved calculations match."
        />
        <LinkPicker
          label="Related records"
          options={recOptions}
          selected={fields.relatedRecordIds}
          onChange={(v) => set('relatedRecordIds', v)}
          loading={recs.isLoading}
          emptyText="No records match."
        />
      </div>
      {(errors.calculationIds || errors.relatedRecordIds) && (
        <p className="field-error">{errors.calculationIds ?? errors.relatedRecordIds}</p>
      )}

      <div className="sticky bottom-0 flex flex-wrap items-end gap-3 border-t border-line bg-paper py-3">
        {record && (
          <div className="field min-w-0 flex-[1_1_22rem]">
            <label htmlFor="rec-change-note" className="text-sm">
              Why this change <span className="font-normal text-muted">(optional, shown in the history)</span>
            </label>
            <input
              id="rec-change-note"
              className="input"
              value={changeNote}
              maxLength={MAX_CHANGE_NOTE}
              onChange={(e) => setChangeNote(e.target.value)}
              placeholder="e.g. Added the bollard pull results"
              aria-invalid={errors.changeNote ? true : undefined}
              aria-describedby={errors.changeNote ? 'rec-change-note-error' : undefined}
            />
            {errors.changeNote && (
              <p id="rec-change-note-error" className="field-error">
                {errors.changeNote}
              </p>
            )}
          </div>
        )}
        <button type="submit" className="btn btn-primary" disabled={saving || kept}>
          {saving
            ? 'Saving…'
            : record
              ? 'Save changes'
              : `Create ${kind === 'decision' ? 'decision record' : 'lesson'}`}
        </button>
        {record && (
          <a className="btn btn-quiet" href={`/records/${record.id}`}>
            Back to the record
          </a>
        )}
        <span className="text-sm text-muted" aria-live="polite">
          {dirty ? 'Unsaved changes' : record ? `Version ${version}, saved` : ''}
        </span>
      </div>
    </form>
  );
}

function newLabel(kind: RecordKind, title: string): string {
  return `New ${kind === 'lesson' ? 'lesson' : 'decision record'} ‘${title}’`;
}

/** A kept edit that is now saved (or kept again) leaves the outbox. */
async function dropKept(entryId: string | null): Promise<void> {
  if (entryId) await import('~/lib/client/outbox').then((m) => m.discardChange(entryId));
}
