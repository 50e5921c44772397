import { useId, useState, type FormEvent } from 'react';
import useSWR from 'swr';
import { apiFetch, ApiError, fetcher } from '~/lib/client/api';
import { can } from '~/lib/policy';
import type { CommentKind, Role } from '~/lib/domain';

export interface CommentItem {
  id: string;
  kind: CommentKind;
  body: string;
  replyTo: string | null;
  createdAt: string;
  authorId: string | null;
  author: string;
  authorRole: string | null;
  answeredAt: string | null;
  answeredBy: string | null;
}

/**
 * Questions and notes on a record, each with its answers under it. A question's asker, the record's author, an
 * advisor or a lead can mark it answered; asking e-mails the record's author and the subsystem's earlier owners.
 */
export default function Comments({
  recordId,
  recordAuthorId,
  me,
  initial,
}: {
  recordId: string;
  recordAuthorId: string | null;
  me: { id: string; role: Role };
  initial: CommentItem[];
}) {
  const key = `/api/records/${recordId}/comments`;
  const { data, mutate } = useSWR<{ comments: CommentItem[] }>(key, fetcher, {
    fallbackData: { comments: initial },
    revalidateOnMount: false,
  });
  const comments = data?.comments ?? [];
  const canComment = can(me, 'record:comment');
  const roots = comments.filter((c) => !c.replyTo || !comments.some((p) => p.id === c.replyTo));
  const replies = (id: string) => comments.filter((c) => c.replyTo === id);
  const questions = roots.filter((c) => c.kind === 'question');
  const open = questions.filter((c) => !c.answeredAt).length;
  return (
    <section aria-labelledby="comments-h" className="flex flex-col gap-4">
      <h2 id="comments-h" className="text-lg font-semibold">
        Questions and notes ({roots.length})
      </h2>
      {questions.length > 0 && (
        <p className="text-sm text-muted">
          {open === 0
            ? 'Every question here is answered.'
            : `${open} open question${open === 1 ? '' : 's'}: the record’s author and the people who looked after this subsystem in earlier seasons were told.`}
        </p>
      )}
      {comments.length === 0 && (
        <p className="text-sm text-muted">
          Nothing asked yet. A question reaches whoever wrote this record and the people who looked after its subsystem
          in earlier seasons.
        </p>
      )}
      <ol className="flex flex-col gap-3">
        {roots.map((c) => {
          const mayMark =
            c.kind === 'question' &&
            !c.answeredAt &&
            can(me, 'question:mark-answered', { isOwn: c.authorId === me.id || recordAuthorId === me.id });
          return (
            <li
              key={c.id}
              id={`comment-${c.id}`}
              className="scroll-mt-24 rounded-lg border border-line bg-surface p-3"
              aria-label={c.kind === 'question' ? `Question from ${c.author}` : `Note from ${c.author}`}
            >
              <CommentBody c={c} />
              {replies(c.id).length > 0 && (
                <ol
                  className="mt-3 flex flex-col gap-2 border-l-2 border-line pl-3"
                  aria-label={c.kind === 'question' ? 'Answers' : 'Replies'}
                >
                  {replies(c.id).map((r) => (
                    <li key={r.id} id={`comment-${r.id}`}>
                      <CommentBody c={r} />
                    </li>
                  ))}
                </ol>
              )}
              <div className="flex flex-wrap items-start gap-3">
                {canComment && (
                  <CommentForm
                    recordId={recordId}
                    replyTo={c.id}
                    label={c.kind === 'question' ? 'Answer' : 'Reply'}
                    onDone={() => void mutate()}
                  />
                )}
                {mayMark && <MarkAnswered id={c.id} onDone={() => void mutate()} />}
              </div>
            </li>
          );
        })}
      </ol>
      {canComment && (
        <CommentForm recordId={recordId} label="Ask a question or add a note" onDone={() => void mutate()} />
      )}
    </section>
  );
}

function CommentBody({ c }: { c: CommentItem }) {
  return (
    <div>
      <p className="flex flex-wrap items-baseline gap-x-2 text-sm">
        {c.kind === 'question' && !c.replyTo && (
          <span className={c.answeredAt ? 'status status-accepted' : 'status status-open'}>
            <span aria-hidden="true">{c.answeredAt ? '✓' : '?'}</span>
            {c.answeredAt ? 'Answered question' : 'Open question'}
          </span>
        )}
        <strong>{c.author}</strong>
        {c.authorRole && <span className="text-muted">{c.authorRole}</span>}
        <time className="text-muted tabular" dateTime={c.createdAt}>
          {c.createdAt.slice(0, 10)}
        </time>
      </p>
      <p className="mt-1 whitespace-pre-line">{c.body}</p>
      {c.answeredAt && (
        <p className="mt-1 text-xs text-muted">
          Marked answered by {c.answeredBy} on {c.answeredAt.slice(0, 10)}
        </p>
      )}
    </div>
  );
}

function MarkAnswered({ id, onDone }: { id: string; onDone: () => void }) {
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState('');
  return (
    <div className="mt-2">
      <button
        type="button"
        className="btn btn-quiet text-sm"
        disabled={busy}
        onClick={async () => {
          setBusy(true);
          setError('');
          try {
            await apiFetch(`/api/comments/${id}/answered`, { method: 'POST', json: {} });
            onDone();
          } catch (e) {
            setError(e instanceof ApiError ? e.message : 'Could not reach the server; try again.');
          } finally {
            setBusy(false);
          }
        }}
      >
        {busy ? 'Marking…' : 'Mark answered'}
      </button>
      {error && (
        <p role="alert" className="field-error">
          {error}
        </p>
      )}
    </div>
  );
}

function CommentForm({
  recordId,
  replyTo,
  label,
  onDone,
}: {
  recordId: string;
  replyTo?: string;
  label: string;
  onDone: () => void;
}) {
  const compact = !!replyTo;
  const [body, setBody] = useState('');
  const [kind, setKind] = useState<CommentKind>('question');
  const [open, setOpen] = useState(!compact);
  const [error, setError] = useState('');
  const [busy, setBusy] = useState(false);
  const id = `comment-form-${replyTo ?? 'new'}`;
  const kindName = useId();
  if (!open)
    return (
      <button type="button" className="mt-2 text-sm text-accent underline" onClick={() => setOpen(true)}>
        {label}
      </button>
    );
  async function submit(e: FormEvent) {
    e.preventDefault();
    setBusy(true);
    setError('');
    try {
      await apiFetch(`/api/records/${recordId}/comments`, {
        method: 'POST',
        json: replyTo ? { body, replyTo } : { body, kind },
      });
      setBody('');
      if (compact) setOpen(false);
      onDone();
    } catch (err) {
      setError(
        err instanceof ApiError
          ? (err.fieldErrors().body ?? err.message)
          : 'Could not reach the server; your text is still here.',
      );
    } finally {
      setBusy(false);
    }
  }
  return (
    <form onSubmit={submit} className="mt-2 flex w-full flex-col gap-2" noValidate>
      <label htmlFor={id} className={compact ? 'sr-only' : 'text-sm font-semibold'}>
        {label}
      </label>
      {!compact && (
        <fieldset className="flex flex-wrap gap-4 text-sm">
          <legend className="sr-only">What are you writing?</legend>
          <label className="flex items-center gap-1.5">
            <input
              type="radio"
              name={kindName}
              value="question"
              checked={kind === 'question'}
              onChange={() => setKind('question')}
            />
            A question (the people who know are told)
          </label>
          <label className="flex items-center gap-1.5">
            <input
              type="radio"
              name={kindName}
              value="note"
              checked={kind === 'note'}
              onChange={() => setKind('note')}
            />
            A note
          </label>
        </fieldset>
      )}
      <textarea
        id={id}
        className="input min-h-20"
        value={body}
        onChange={(e) => setBody(e.target.value)}
        maxLength={5000}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : undefined}
      />
      {error && (
        <p id={`${id}-error`} className="field-error">
          {error}
        </p>
      )}
      <button type="submit" className="btn btn-quiet self-start text-sm" disabled={busy}>
        {busy ? 'Posting…' : compact ? `Post ${label.toLowerCase()}` : kind === 'question' ? 'Ask' : 'Post note'}
      </button>
    </form>
  );
}
