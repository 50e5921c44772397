import { useId, useRef, useState, type FormEvent } from 'react';
import { apiErrorMessage, type ApiErrorBody } from '~/lib/client/api';
import {
  fileSize,
  IMPORT_ACCEPT,
  limitsInWords,
  problemWith,
  problemWithAll,
  type ImportLimits,
} from '~/lib/import-files';
import type { RecordKind } from '~/lib/domain';
import DropZone from '../ui/DropZone';

interface Option {
  value: string;
  label: string;
}

interface Props {
  subsystems: Option[];
  defaultSubsystem?: string;
  /** Seasons a lead may choose; a member imports into the current season only. */
  seasons: Option[];
  canPickSeason: boolean;
  currentSeason: Option | null;
  limits: ImportLimits;
}

type Sending = { state: 'idle' } | { state: 'uploading'; loaded: number; total: number } | { state: 'converting' };

/**
 * Choose or drop documents, say where they belong, and start: the files upload with a real progress bar (XHR, since
 * fetch reports no upload progress), then the page of the new import follows their conversion.
 */
export default function ImportForm({
  subsystems,
  defaultSubsystem,
  seasons,
  canPickSeason,
  currentSeason,
  limits,
}: Props) {
  const [files, setFiles] = useState<File[]>([]);
  const [subsystem, setSubsystem] = useState(defaultSubsystem ?? '');
  const [kind, setKind] = useState<RecordKind>('decision');
  const [seasonId, setSeasonId] = useState(canPickSeason ? '' : (currentSeason?.value ?? ''));
  const [sending, setSending] = useState<Sending>({ state: 'idle' });
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [problem, setProblem] = useState('');
  const input = useRef<HTMLInputElement>(null);
  const ids = useId();

  const add = (list: FileList | File[]) => {
    const known = new Set(files.map((f) => `${f.name}:${f.size}`));
    setFiles([...files, ...Array.from(list).filter((f) => !known.has(`${f.name}:${f.size}`))]);
    setErrors((e) => Object.fromEntries(Object.entries(e).filter(([k]) => k !== 'file')));
    setProblem('');
  };
  const remove = (i: number) => setFiles(files.filter((_, j) => j !== i));
  const fileProblems = files.map((f) => problemWith(f, limits));
  const allProblem = problemWithAll(files, limits);
  const busy = sending.state !== 'idle';

  function start(e: FormEvent) {
    e.preventDefault();
    const found: Record<string, string> = {};
    if (files.length === 0) found.file = 'Choose at least one file.';
    if (!subsystem) found.subsystem = 'Choose a subsystem.';
    setErrors(found);
    setProblem('');
    if (Object.keys(found).length || fileProblems.some(Boolean) || allProblem) return;
    const form = new FormData();
    for (const f of files) form.append('file', f, f.name);
    form.set('subsystem', subsystem);
    form.set('kind', kind);
    if (seasonId) form.set('seasonId', seasonId);
    const xhr = new XMLHttpRequest();
    xhr.open('POST', '/api/imports');
    xhr.setRequestHeader('accept', 'application/json');
    xhr.upload.onprogress = (ev) => {
      if (ev.lengthComputable) setSending({ state: 'uploading', loaded: ev.loaded, total: ev.total });
    };
    xhr.onload = () => {
      if (xhr.status === 202) {
        setSending({ state: 'converting' });
        try {
          const id = (JSON.parse(xhr.responseText) as { import: { id: string } }).import.id;
          window.location.assign(`/import/${encodeURIComponent(id)}`);
        } catch {
          window.location.assign('/import');
        }
        return;
      }
      setSending({ state: 'idle' });
      setProblem(sentenceFor(xhr.status, xhr.responseText));
      if (xhr.status === 400) {
        const body = parse(xhr.responseText);
        const fields: Record<string, string> = {};
        for (const i of body?.error.issues ?? []) fields[i.path] ??= i.message;
        setErrors(fields);
      }
    };
    xhr.onerror = () => {
      setSending({ state: 'idle' });
      setProblem('Could not reach the server; nothing was imported. Check the connection and start again.');
    };
    setSending({ state: 'uploading', loaded: 0, total: files.reduce((a, f) => a + f.size, 0) });
    xhr.send(form);
  }

  const total = files.reduce((a, f) => a + f.size, 0);
  return (
    <form onSubmit={start} noValidate className="flex flex-col gap-5" aria-describedby={`${ids}-limits`}>
      <div className="flex flex-col gap-2">
        <DropZone onFiles={add} className="p-6 text-center" idle="border-line bg-surface">
          <p className="font-semibold">Drop documents or a zipped folder here</p>
          <p className="mx-auto mt-1 max-w-md text-sm text-muted">
            Word (.docx), Markdown (.md, .markdown), web pages (.html, .htm), text (.txt), PDF (.pdf), or a .zip of a
            folder of them.
          </p>
          <button
            type="button"
            className="btn btn-quiet mt-3"
            onClick={() => input.current?.click()}
            disabled={busy}
            aria-describedby={errors.file ? `${ids}-file-error` : undefined}
          >
            Choose files…
          </button>
          <input
            ref={input}
            type="file"
            multiple
            className="sr-only"
            aria-label="Documents to import"
            tabIndex={-1}
            accept={IMPORT_ACCEPT}
            onChange={(e) => {
              if (e.target.files?.length) add(e.target.files);
              e.target.value = '';
            }}
          />
        </DropZone>
        {errors.file && (
          <p id={`${ids}-file-error`} className="field-error" role="alert">
            {errors.file}
          </p>
        )}
        <ul id={`${ids}-limits`} className="text-sm text-muted">
          {limitsInWords(limits).map((l) => (
            <li key={l}>{l}</li>
          ))}
        </ul>
      </div>

      {files.length > 0 && (
        <section aria-labelledby={`${ids}-chosen`} className="flex flex-col gap-2">
          <h2 id={`${ids}-chosen`} className="font-semibold">
            {files.length} {files.length === 1 ? 'file' : 'files'} chosen · {fileSize(total)}
          </h2>
          {files.length > 1 && (
            <p>
              <button
                type="button"
                className="btn btn-quiet px-2 py-1 text-xs"
                onClick={() => setFiles([])}
                disabled={busy}
              >
                Remove all
              </button>
            </p>
          )}
          <ul
            className="flex max-h-80 flex-col divide-y divide-line overflow-y-auto rounded-lg border border-line bg-surface"
            aria-label="Chosen files"
            tabIndex={files.length > 6 ? 0 : undefined}
          >
            {files.map((f, i) => (
              <li key={`${f.name}:${f.size}`} className="flex flex-wrap items-center gap-x-3 gap-y-1 px-3 py-2 text-sm">
                <span className="min-w-0 flex-1 break-words">{f.name}</span>
                <span className="tabular text-muted">{fileSize(f.size)}</span>
                <button
                  type="button"
                  className="btn btn-quiet px-2 py-1 text-xs"
                  onClick={() => remove(i)}
                  disabled={busy}
                  aria-label={`Remove ${f.name}`}
                >
                  Remove
                </button>
                {fileProblems[i] && <p className="field-error w-full">{fileProblems[i]}</p>}
              </li>
            ))}
          </ul>
          {allProblem && (
            <p className="field-error" role="alert">
              {allProblem}
            </p>
          )}
        </section>
      )}

      <div className="grid gap-4 sm:grid-cols-2">
        <div className="field">
          <label htmlFor={`${ids}-subsystem`}>Subsystem</label>
          <select
            id={`${ids}-subsystem`}
            className="input"
            value={subsystem}
            onChange={(e) => setSubsystem(e.target.value)}
            aria-invalid={errors.subsystem ? true : undefined}
            aria-describedby={errors.subsystem ? `${ids}-subsystem-error` : undefined}
            disabled={busy}
          >
            <option value="">Choose…</option>
            {subsystems.map((s) => (
              <option key={s.value} value={s.value}>
                {s.label}
              </option>
            ))}
          </select>
          {errors.subsystem && (
            <p id={`${ids}-subsystem-error`} className="field-error">
              {errors.subsystem}
            </p>
          )}
        </div>
        <div className="field">
          <label htmlFor={`${ids}-season`}>Season</label>
          {canPickSeason ? (
            <select
              id={`${ids}-season`}
              className="input"
              value={seasonId}
              onChange={(e) => setSeasonId(e.target.value)}
              aria-invalid={errors.seasonId ? true : undefined}
              aria-describedby={errors.seasonId ? `${ids}-season-error` : `${ids}-season-hint`}
              disabled={busy}
            >
              <option value="">By each file’s own date</option>
              {seasons.map((s) => (
                <option key={s.value} value={s.value}>
                  {s.label}
                </option>
              ))}
            </select>
          ) : (
            <input
              id={`${ids}-season`}
              className="input bg-sunken"
              value={currentSeason?.label ?? 'No season is current'}
              readOnly
              aria-describedby={`${ids}-season-hint`}
            />
          )}
          <p id={`${ids}-season-hint`} className="text-xs text-muted">
            {canPickSeason
              ? 'The season a file’s own date (saved inside it, or in the zip) falls in; else the current one.'
              : 'Members import into the current season; a lead can move drafts to earlier seasons.'}
          </p>
          {errors.seasonId && (
            <p id={`${ids}-season-error`} className="field-error">
              {errors.seasonId}
            </p>
          )}
        </div>
      </div>

      <fieldset className="field" aria-describedby={errors.kind ? `${ids}-kind-error` : undefined}>
        <legend className="mb-1 font-semibold">Each file becomes a draft</legend>
        <div className="flex flex-wrap gap-x-6 gap-y-2">
          {(['decision', 'lesson'] as const).map((k) => (
            <label key={k} className="flex items-center gap-2">
              <input
                type="radio"
                name={`${ids}-kind`}
                value={k}
                checked={kind === k}
                onChange={() => setKind(k)}
                disabled={busy}
              />
              {k === 'decision' ? 'decision record' : 'lesson'}
            </label>
          ))}
        </div>
        {errors.kind && (
          <p id={`${ids}-kind-error`} className="field-error">
            {errors.kind}
          </p>
        )}
        <p className="text-xs text-muted">You can change the kind, subsystem and season of many drafts afterwards.</p>
      </fieldset>

      {problem && (
        <p className="alert" role="alert">
          {problem}
        </p>
      )}

      <div className="flex flex-col gap-2" aria-live="polite">
        {sending.state === 'uploading' && (
          <>
            <label htmlFor={`${ids}-upload`} className="text-sm">
              Uploading {files.length} {files.length === 1 ? 'file' : 'files'}: {fileSize(sending.loaded)} of{' '}
              {fileSize(sending.total)}
            </label>
            <progress id={`${ids}-upload`} className="w-full" max={sending.total || 1} value={sending.loaded} />
          </>
        )}
        {sending.state === 'converting' && <p className="text-sm">Uploaded. Opening the import…</p>}
        <p>
          <button type="submit" className="btn btn-primary" disabled={busy}>
            {busy ? 'Importing…' : 'Start import'}
          </button>
        </p>
      </div>
    </form>
  );
}

function parse(text: string): ApiErrorBody | null {
  try {
    return JSON.parse(text) as ApiErrorBody;
  } catch {
    return null;
  }
}

/** The answer to a refused upload, as a sentence (413 and 415 say which limit or which files). */
function sentenceFor(status: number, text: string): string {
  const message = apiErrorMessage(text);
  if (status === 413)
    return `${message ?? 'The files are over the import’s limits.'} Nothing was imported; send fewer or smaller files.`;
  if (status === 415) return message ?? 'None of these files can be imported; nothing was imported.';
  if (status === 401) return 'You were signed out. Sign in again and start the import once more.';
  if (status === 400) return message ?? 'Some fields need attention.';
  return message ?? `The import could not start (${status}). Nothing was imported; try again.`;
}
