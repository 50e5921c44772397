import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { EditorContent, useEditor, type JSONContent } from '@tiptap/react';
import useSWR from 'swr';
import { recordExtensions } from '~/lib/editor/extensions';
import { templateFor } from '~/lib/editor/templates';
import { apiFetch, ApiError, fetcher } from '~/lib/client/api';
import { LESSON_SOURCES, type LessonSource, type RecordKind } from '~/lib/domain';
import Toolbar from './Toolbar';
import LinkPicker, { type PickOption } from './LinkPicker';
import { draftKey, readDraft, writeDraft, clearDraft, type Draft } from './drafts';

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
  bodyHtml: string;
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
  const initialBody = record?.body ?? templateFor(kind);
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
  const [conflict, setConflict] = useState<Conflict | null>(null);
  const leaving = useRef(false);

  const extensions = useMemo(() => recordExtensions(), []);
  const editor = useEditor({
    extensions,
    content: initialBody,
    immediatelyRender: false,
    editorProps: {
      attributes: {
        class: 'prose-wb min-h-[24rem] px-4 py-3 focus:outline-none',
        'aria-label': 'Record text',
        role: 'textbox',
        'aria-multiline': 'true',
      },
    },
    onUpdate: ({ editor: e }) => setBodyJson(e.getJSON()),
  });

  const dirty = JSON.stringify({ fields, body: bodyJson }) !== saved;

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
    calculations: { id: string; title: string; kind: string; season: string; subsystemName: string }[];
  }>('/api/calculations?limit=100', fetcher);
  const recs = useSWR<{
    records: { id: string; title: string; kind: string; season: string; subsystemName: string }[];
  }>('/api/records?limit=100', fetcher);
  const calcOptions: PickOption[] = (calcs.data?.calculations ?? []).map((c) => ({
    id: c.id,
    title: c.title,
    detail: `${c.kind} · ${c.subsystemName} · ${c.season}`,
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
          });
          clearDraft(key);
          leaving.current = true;
          window.location.assign(res.record.url);
          return;
        }
        const res = await apiFetch<{ record: { version: number; url: string } }>(`/api/records/${record.id}`, {
          method: 'PATCH',
          json: { version: overrideVersion ?? version, ...payload },
        });
        setVersion(res.record.version);
        setSaved(JSON.stringify({ fields, body }));
        setBodyJson(body);
        clearDraft(key);
        setConflict(null);
        setMessage({ tone: 'ok', text: `Saved as version ${res.record.version}.` });
      } catch (e) {
        if (e instanceof ApiError && e.status === 409 && e.body?.error.current) {
          const cur = e.body.error.current as {
            version: number;
            title: string;
            bodyHtml: string;
            body: JSONContent;
            updatedBy: { name: string } | null;
          };
          setConflict({
            version: cur.version,
            title: cur.title,
            bodyHtml: cur.bodyHtml,
            body: cur.body,
            updatedBy: cur.updatedBy?.name ?? null,
          });
          setMessage({
            tone: 'error',
            text: 'Not saved: someone else saved this record while you were editing. Your text is safe here; choose below how to combine the two.',
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
    [editor, fields, canPickSeason, kind, record, version, key],
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

  const mergeBelow = () => {
    if (!conflict || !editor) return;
    const mine = editor.getJSON().content ?? [];
    const theirs = conflict.body.content ?? [];
    const merged: JSONContent = {
      type: 'doc',
      content: [
        ...mine,
        { type: 'horizontalRule' },
        {
          type: 'heading',
          attrs: { level: 2 },
          content: [
            { type: 'text', text: `Their version ${conflict.version} — merge what you need, then delete this part` },
          ],
        },
        ...theirs,
      ],
    };
    editor.commands.setContent(merged);
    setBodyJson(merged);
    setVersion(conflict.version);
    setConflict(null);
    setMessage({ tone: 'ok', text: 'Both texts are in the editor now: theirs below the line. Merge them, then save.' });
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
        <section className="card flex flex-col gap-3" aria-labelledby="conflict-h">
          <h2 id="conflict-h" className="text-lg font-semibold">
            Two versions of this record
          </h2>
          <div className="grid gap-4 md:grid-cols-2">
            <div>
              <p className="eyebrow">Yours (not saved yet)</p>
              <p className="font-semibold">{fields.title}</p>
              <div
                className="prose-wb max-h-80 overflow-auto rounded border border-line p-3 text-sm"
                dangerouslySetInnerHTML={{ __html: editor.getHTML() }}
              />
            </div>
            <div>
              <p className="eyebrow">
                Theirs: version {conflict.version}
                {conflict.updatedBy ? ` by ${conflict.updatedBy}` : ''}
              </p>
              <p className="font-semibold">{conflict.title}</p>
              {/* Rendered by the server from a validated document, never from client HTML. */}
              <div
                className="prose-wb max-h-80 overflow-auto rounded border border-line p-3 text-sm"
                dangerouslySetInnerHTML={{ __html: conflict.bodyHtml }}
              />
            </div>
          </div>
          <div className="flex flex-wrap gap-2">
            <button type="button" className="btn btn-primary" onClick={mergeBelow}>
              Merge: put theirs below mine
            </button>
            <button type="button" className="btn btn-quiet" onClick={keepMine}>
              Save mine as the newer version
            </button>
            <button type="button" className="btn btn-quiet" onClick={takeTheirs}>
              Take theirs
            </button>
          </div>
          <p className="text-xs text-muted">Whichever you choose, every saved version stays in the record’s history.</p>
        </section>
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
        <div className="field">
          <label htmlFor="rec-subsystem">Subsystem</label>
          <select
            id="rec-subsystem"
            className="input"
            value={fields.subsystem}
            onChange={(e) => set('subsystem', e.target.value)}
            aria-invalid={errors.subsystem ? true : undefined}
          >
            {subsystems.map((s) => (
              <option key={s.slug} value={s.slug}>
                {s.name}
              </option>
            ))}
          </select>
          {errors.subsystem && <p className="field-error">{errors.subsystem}</p>}
        </div>
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
        <div className="overflow-hidden rounded-lg border border-line bg-surface" aria-labelledby="body-label">
          <Toolbar editor={editor} />
          <EditorContent editor={editor} />
        </div>
        {errors.body && <p className="field-error">{errors.body}</p>}
        <p className="mt-1 text-xs text-muted">
          Keep the section headings; replace the italic prompts. Unsaved changes are kept in this browser. Ctrl+S saves.
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

      <div className="sticky bottom-0 flex flex-wrap items-center gap-3 border-t border-line bg-paper py-3">
        <button type="submit" className="btn btn-primary" disabled={saving}>
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
