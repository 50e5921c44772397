import { useState, type FormEvent } from 'react';
import useSWR from 'swr';
import { apiFetch, ApiError, fetcher } from '~/lib/client/api';

interface Comment {
  id: string;
  body: string;
  parentId: string | null;
  createdAt: string;
  author: string;
  authorRole: string | null;
}

/** Questions and answers on a record; alumni answer the new cohort here. */
export default function Comments({
  recordId,
  canComment,
  initial,
}: {
  recordId: string;
  canComment: boolean;
  initial: Comment[];
}) {
  const key = `/api/records/${recordId}/comments`;
  const { data, mutate } = useSWR<{ comments: Comment[] }>(key, fetcher, {
    fallbackData: { comments: initial },
    revalidateOnMount: false,
  });
  const comments = data?.comments ?? [];
  const roots = comments.filter((c) => !c.parentId || !comments.some((p) => p.id === c.parentId));
  const replies = (id: string) => comments.filter((c) => c.parentId === id);
  return (
    <section aria-labelledby="comments-h" className="flex flex-col gap-4">
      <h2 id="comments-h" className="text-lg font-semibold">
        Questions and answers ({comments.length})
      </h2>
      {comments.length === 0 && (
        <p className="text-sm text-muted">
          No questions yet. Ask here: alumni who wrote or lived this record get to answer.
        </p>
      )}
      <ol className="flex flex-col gap-3">
        {roots.map((c) => (
          <li key={c.id} className="rounded-lg border border-line bg-surface p-3">
            <CommentBody c={c} />
            {replies(c.id).length > 0 && (
              <ol className="mt-3 flex flex-col gap-2 border-l-2 border-line pl-3">
                {replies(c.id).map((r) => (
                  <li key={r.id}>
                    <CommentBody c={r} />
                  </li>
                ))}
              </ol>
            )}
            {canComment && (
              <CommentForm recordId={recordId} parentId={c.id} label="Answer" onDone={() => mutate()} compact />
            )}
          </li>
        ))}
      </ol>
      {canComment && <CommentForm recordId={recordId} label="Ask a question or add a note" onDone={() => mutate()} />}
    </section>
  );
}

function CommentBody({ c }: { c: Comment }) {
  return (
    <div>
      <p className="text-sm">
        <strong>{c.author}</strong>
        {c.authorRole && <span className="text-muted"> · {c.authorRole}</span>}{' '}
        <time className="text-muted tabular" dateTime={c.createdAt}>
          · {c.createdAt.slice(0, 10)}
        </time>
      </p>
      <p className="mt-1 whitespace-pre-line">{c.body}</p>
    </div>
  );
}

function CommentForm({
  recordId,
  parentId,
  label,
  onDone,
  compact = false,
}: {
  recordId: string;
  parentId?: string;
  label: string;
  onDone: () => void;
  compact?: boolean;
}) {
  const [body, setBody] = useState('');
  const [open, setOpen] = useState(!compact);
  const [error, setError] = useState('');
  const [busy, setBusy] = useState(false);
  const id = `comment-${parentId ?? 'new'}`;
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
        json: { body, ...(parentId ? { parentId } : {}) },
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
    <form onSubmit={submit} className="mt-2 flex flex-col gap-2" noValidate>
      <label htmlFor={id} className={compact ? 'sr-only' : 'text-sm font-semibold'}>
        {label}
      </label>
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
        {busy ? 'Posting…' : compact ? 'Post answer' : 'Post'}
      </button>
    </form>
  );
}
