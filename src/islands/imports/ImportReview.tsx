import { useEffect, useId, useRef, useState, type FormEvent } from 'react';
import useSWR from 'swr';
import { apiFetch, ApiError, fetcher } from '~/lib/client/api';
import { fileSize } from '~/lib/import-files';
import type { ImportReview as Review, ImportReviewRow } from '~/lib/schemas/import-review';
import type { ImportItemState, ImportState } from '~/lib/domain';
import SelectField from '../ui/SelectField';

interface Option {
  value: string;
  label: string;
}

/** What GET /api/imports/{id} answers (the fields this island follows). */
interface Progress {
  import: { id: string; state: ImportState; total: number; done: number; items: { state: ImportItemState }[] };
}

interface Props {
  initial: Review;
  subsystems: Option[];
  /** The seasons drafts may be moved to (a member: the current one only). */
  seasons: Option[];
}

const POLL_MS = 1000;

/**
 * One import: its conversion progress (polled until every file is done) and the review list of what each file
 * became, where many drafts at once get another kind, subsystem or season, or are discarded.
 */
export default function ImportReview({ initial, subsystems, seasons }: Props) {
  const id = initial.id;
  // A finished import needs no polling; a running one is asked every second until it is done.
  const { data: progress, error: progressError } = useSWR<Progress, unknown>(
    initial.state === 'done' ? null : `/api/imports/${id}`,
    fetcher,
    { refreshInterval: (latest) => (latest?.import.state === 'done' ? 0 : POLL_MS) },
  );
  const { data, mutate } = useSWR<{ review: Review }>(`/api/imports/${id}/records`, fetcher, {
    fallbackData: { review: initial },
    revalidateOnMount: false,
    revalidateOnFocus: true,
  });
  const review = data?.review ?? initial;
  const state = progress?.import.state ?? review.state;
  const done = progress?.import.done ?? review.done;
  const total = progress?.import.total ?? review.total;

  // The review list follows the conversion: each file that finishes shows its draft.
  const seen = useRef(`${review.state}:${review.done}`);
  useEffect(() => {
    const now = `${state}:${done}`;
    if (now === seen.current) return;
    seen.current = now;
    void mutate();
  }, [state, done, mutate]);

  const ids = useId();
  const counts = countStates(review.rows);
  return (
    <div className="flex flex-col gap-6">
      <section aria-labelledby={`${ids}-progress`} className="card flex flex-col gap-2">
        <h2 id={`${ids}-progress`} className="text-lg font-semibold">
          {state === 'done' ? 'Conversion finished' : 'Converting the files'}
        </h2>
        <label htmlFor={`${ids}-bar`} className="text-sm">
          {done} of {total} {total === 1 ? 'file' : 'files'} done
          {state !== 'done' && ' — you can leave this page and come back; the import goes on.'}
        </label>
        <progress id={`${ids}-bar`} className="w-full" max={total || 1} value={done} />
        <p className="text-sm text-muted" aria-live="polite">
          {[
            counts.done && `${counts.done} imported as drafts`,
            counts.skipped && `${counts.skipped} already here`,
            counts.failed && `${counts.failed} could not be read`,
            counts.queued && `${counts.queued} waiting`,
          ]
            .filter(Boolean)
            .join(' · ') || 'Waiting for the first file…'}
        </p>
        {progressError !== undefined && (
          <p className="field-error" role="alert">
            {progressError instanceof ApiError ? progressError.message : 'Lost touch with the server; retrying.'}
          </p>
        )}
      </section>
      <ReviewList review={review} subsystems={subsystems} seasons={seasons} onChanged={() => void mutate()} />
    </div>
  );
}

function countStates(rows: ImportReviewRow[]) {
  const c = { queued: 0, done: 0, skipped: 0, failed: 0 };
  for (const r of rows) c[r.state] += 1;
  return c;
}

function ReviewList({
  review,
  subsystems,
  seasons,
  onChanged,
}: {
  review: Review;
  subsystems: Option[];
  seasons: Option[];
  onChanged: () => void;
}) {
  const ids = useId();
  const drafts = review.rows.flatMap((r) => (r.draft ? [r.draft.id] : []));
  const [picked, setPicked] = useState<Set<string>>(new Set());
  // Drafts discarded or moved on since they were picked no longer count.
  const selected = drafts.filter((d) => picked.has(d));
  const all = drafts.length > 0 && selected.length === drafts.length;
  const some = selected.length > 0 && !all;
  const allBox = useRef<HTMLInputElement>(null);
  useEffect(() => {
    if (allBox.current) allBox.current.indeterminate = some;
  }, [some]);
  const toggle = (id: string) =>
    setPicked((p) => {
      const n = new Set(p);
      if (n.has(id)) n.delete(id);
      else n.add(id);
      return n;
    });

  const [kind, setKind] = useState('');
  const [subsystem, setSubsystem] = useState('');
  const [seasonId, setSeasonId] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState('');
  const [busy, setBusy] = useState(false);
  const [asking, setAsking] = useState(false);

  async function apply(e: FormEvent) {
    e.preventDefault();
    setErrors({});
    setMessage('');
    if (!kind && !subsystem && !seasonId) {
      setErrors({ kind: 'Choose a kind, a subsystem or a season to change.' });
      return;
    }
    setBusy(true);
    try {
      const res = await apiFetch<{ updated: number }>(`/api/imports/${review.id}/records`, {
        method: 'PATCH',
        json: {
          recordIds: selected,
          ...(kind ? { kind } : {}),
          ...(subsystem ? { subsystem } : {}),
          ...(seasonId ? { seasonId } : {}),
        },
      });
      setMessage(
        res.updated === 0
          ? 'Nothing to change: the selected drafts already are so.'
          : `Changed ${res.updated} ${res.updated === 1 ? 'draft' : 'drafts'}.`,
      );
      setKind('');
      setSubsystem('');
      setSeasonId('');
      onChanged();
    } catch (err) {
      if (err instanceof ApiError) {
        setErrors(err.fieldErrors());
        setMessage(err.message);
      } else setMessage('Could not reach the server; nothing was changed.');
    } finally {
      setBusy(false);
    }
  }

  async function discard() {
    setBusy(true);
    setMessage('');
    try {
      const res = await apiFetch<{ discarded: number }>(`/api/imports/${review.id}/discard`, {
        method: 'POST',
        json: { recordIds: selected },
      });
      setMessage(`Discarded ${res.discarded} ${res.discarded === 1 ? 'draft' : 'drafts'}.`);
      setPicked(new Set());
      setAsking(false);
      onChanged();
    } catch (err) {
      setMessage(err instanceof ApiError ? err.message : 'Could not reach the server; nothing was discarded.');
    } finally {
      setBusy(false);
    }
  }

  return (
    <section aria-labelledby={`${ids}-h`} className="flex flex-col gap-3">
      <h2 id={`${ids}-h`} className="text-lg font-semibold">
        Review the drafts
      </h2>
      {review.rows.length === 0 ? (
        <p className="empty">This import holds no files.</p>
      ) : (
        <>
          {drafts.length > 0 && (
            <form onSubmit={apply} className="card flex flex-col gap-3" aria-label="Change the selected drafts">
              <label className="flex items-center gap-2 font-semibold">
                <input
                  ref={allBox}
                  type="checkbox"
                  checked={all}
                  onChange={() => setPicked(all ? new Set() : new Set(drafts))}
                />
                Select all drafts ({selected.length} of {drafts.length} selected)
              </label>
              <div className="grid gap-3 sm:grid-cols-3">
                <BulkSelect
                  label="Kind"
                  value={kind}
                  onChange={setKind}
                  error={errors.kind}
                  options={[
                    { value: 'decision', label: 'decision record' },
                    { value: 'lesson', label: 'lesson' },
                  ]}
                />
                <BulkSelect
                  label="Subsystem"
                  value={subsystem}
                  onChange={setSubsystem}
                  error={errors.subsystem}
                  options={subsystems}
                />
                <BulkSelect
                  label="Season"
                  value={seasonId}
                  onChange={setSeasonId}
                  error={errors.seasonId}
                  options={seasons}
                />
              </div>
              {errors.recordIds && <p className="field-error">{errors.recordIds}</p>}
              <div className="flex flex-wrap gap-2">
                <button type="submit" className="btn btn-primary" disabled={busy || selected.length === 0}>
                  Change {selected.length || ''} selected
                </button>
                <button
                  type="button"
                  className="btn btn-quiet"
                  disabled={busy || selected.length === 0}
                  onClick={() => setAsking(true)}
                >
                  Discard selected…
                </button>
              </div>
              {asking && (
                <div className="alert flex flex-col gap-2 text-sm" role="alertdialog" aria-labelledby={`${ids}-q`}>
                  <p id={`${ids}-q`} className="font-semibold">
                    Discard {selected.length} {selected.length === 1 ? 'draft' : 'drafts'} for good?
                  </p>
                  <p>Their text and attachments go with them. The import still lists their files.</p>
                  <div className="flex flex-wrap gap-2">
                    <button type="button" className="btn btn-danger" onClick={discard} disabled={busy} autoFocus>
                      {busy ? 'Discarding…' : `Yes, discard ${selected.length}`}
                    </button>
                    <button type="button" className="btn btn-quiet" onClick={() => setAsking(false)} disabled={busy}>
                      Keep them
                    </button>
                  </div>
                </div>
              )}
              <p className="text-sm" role="status">
                {message}
              </p>
            </form>
          )}
          <ul className="flex flex-col gap-3" aria-label="Imported files">
            {review.rows.map((row) => (
              <Row key={row.itemId} row={row} checked={row.draft ? picked.has(row.draft.id) : false} toggle={toggle} />
            ))}
          </ul>
        </>
      )}
    </section>
  );
}

/** A bulk-change field: its first choice leaves the selected drafts as they are. */
function BulkSelect(props: {
  label: string;
  value: string;
  onChange: (v: string) => void;
  options: Option[];
  error?: string;
}) {
  return <SelectField id={useId()} empty="Keep as it is" {...props} />;
}

const STATE_WORDS: Record<ImportItemState, string> = {
  queued: 'Waiting',
  done: 'Imported',
  skipped: 'Already here',
  failed: 'Not imported',
};

function Row({ row, checked, toggle }: { row: ImportReviewRow; checked: boolean; toggle: (id: string) => void }) {
  const d = row.draft;
  const boxId = useId();
  return (
    <li className="rounded-lg border border-line bg-surface p-3">
      <div className="flex items-start gap-3">
        {d && (
          <input
            id={boxId}
            type="checkbox"
            className="mt-1.5 shrink-0"
            checked={checked}
            onChange={() => toggle(d.id)}
            aria-label={`Select “${d.title}”`}
          />
        )}
        <div className="min-w-0 flex-1">
          <p className="flex flex-wrap items-baseline gap-x-2">
            {d ? (
              <a href={`/records/${d.id}`} className="font-semibold break-words">
                {d.title}
              </a>
            ) : (
              <span className="font-semibold break-words">{row.fileName}</span>
            )}
            <span
              className={`status ${row.state === 'failed' ? 'status-withdrawn' : row.state === 'done' ? 'status-draft' : 'status-proposed'}`}
            >
              {row.gone === 'discarded'
                ? 'Discarded'
                : row.gone === 'moved-on'
                  ? 'Moved on from draft'
                  : STATE_WORDS[row.state]}
            </span>
          </p>
          <p className="mt-0.5 text-sm text-muted break-words">
            {d ? `${d.kind === 'decision' ? 'Decision record' : 'Lesson'} · ${d.subsystemName} · ${d.season} · ` : ''}
            {d && `${row.fileName} · `}
            {fileSize(row.size)}
          </p>
          {d && d.preview && <p className="mt-1 line-clamp-2 text-sm break-words">{d.preview}</p>}
          {row.state === 'skipped' &&
            (row.existing ? (
              <p className="mt-1 text-sm">
                Already in <a href={`/records/${row.existing.id}`}>‘{row.existing.title}’</a>; not imported again.
              </p>
            ) : (
              <p className="mt-1 text-sm">{row.message ?? 'The same file was imported before.'}</p>
            ))}
          {row.state === 'failed' && <p className="mt-1 text-sm">{row.message ?? 'This file could not be read.'}</p>}
          {row.state === 'queued' && <p className="mt-1 text-sm text-muted">Waiting to be converted…</p>}
          {d && (
            <p className="mt-2">
              <a className="btn btn-quiet px-2 py-1 text-sm" href={`/records/${d.id}/edit`}>
                Open in the editor<span className="sr-only">: {d.title}</span>
              </a>
            </p>
          )}
        </div>
      </div>
    </li>
  );
}
