import { useState, type FormEvent } from 'react';
import useSWR from 'swr';
import { apiFetch, ApiError, fetcher, KeptOnDevice } from '~/lib/client/api';
import type { CommentKind } from '~/lib/domain';

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
  /**
   * Who is reading and what the policy lets them do (decided on the server with can(), so the policy table does
   * not ship to the browser): comment, mark any question answered, or only their own or those on their record.
   */
  me: { id: string; canComment: boolean; markAny: boolean; markOwn: boolean };
  initial: CommentItem[];
}) {
  const key = `/api/records/${recordId}/comments`;
  const { data, mutate } = useSWR<{ comments: CommentItem[] }>(key, fetcher, {
    fallbackData: { comments: initial },
    revalidateOnMount: false,
  });
  const comments = data?.comments ?? [];
  const canComment = me.canComment;
  const roots = comments.filter((c) => !c.replyTo || !comments.some((p) => p.id === c.replyTo));
  const replies = (id: string) => comments.filter((c) => c.replyTo === id);
  return (
    <section aria-labelledby="comments-h" className="flex flex-col gap-4">
      <h2 id="comments-h" className="text-lg font-semibold">
        Questions and notes ({roots.length})
      </h2>
      {comments.length === 0 && <p className="text-sm text-muted">Nothing asked yet.</p>}
      <ol className="flex flex-col gap-3">
        {roots.map((c) => {
          const mayMark =
            c.kind === 'question' &&
            !c.answeredAt &&
            (me.markAny || (me.markOwn && (c.authorId === me.id || recordAuthorId === me.id)));
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

/**
 * Sends one request and shows its error; `run` returns whether it worked. With `offline`, a write made with no
 * network is kept on this device (the outbox sends it later) and counts as done, with a note saying so.
 */
function useSend() {
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState('');
  const [kept, setKept] = useState('');
  async function run(url: string, json: object, field?: string, offline?: { label: string }) {
    setBusy(true);
    setError('');
    setKept('');
    try {
      await apiFetch(url, { method: 'POST', json, offline });
      return true;
    } catch (e) {
      if (e instanceof KeptOnDevice) {
        setKept(e.message);
        return 'kept';
      }
      setError(
        e instanceof ApiError
          ? ((field && e.fieldErrors()[field]) ?? e.message)
          : 'Could not reach the server; your text is still here.',
      );
      return false;
    } finally {
      setBusy(false);
    }
  }
  return { busy, error, kept, run };
}

function MarkAnswered({ id, onDone }: { id: string; onDone: () => void }) {
  const { busy, error, run } = useSend();
  return (
    <div className="mt-2">
      <button
        type="button"
        className="btn btn-quiet text-sm"
        disabled={busy}
        onClick={async () => {
          if (await run(`/api/comments/${id}/answered`, {})) onDone();
        }}
      >
        Mark answered
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
  const [body, setBody] = useState('');
  const [open, setOpen] = useState(!replyTo);
  const { busy, error, kept, run } = useSend();
  const id = `comment-form-${replyTo ?? 'new'}`;
  if (!open)
    return (
      <button type="button" className="mt-2 text-sm text-accent underline" onClick={() => setOpen(true)}>
        {label}
      </button>
    );
  async function submit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    // A new comment's kind is the button pressed: “Ask” or “Add as a note”.
    const kind = (e.nativeEvent as SubmitEvent).submitter?.getAttribute('value') ?? 'question';
    // The record's title is the page's heading: it names the change in the list of changes waiting to be sent.
    const on = document.querySelector('h1')?.textContent?.trim() ?? 'a record';
    const what = replyTo ? 'Answer' : kind === 'note' ? 'Note' : 'Question';
    const json = replyTo ? { body, replyTo } : { body, kind };
    const done = await run(`/api/records/${recordId}/comments`, json, 'body', { label: `${what} on ‘${on}’` });
    if (done) {
      setBody('');
      if (replyTo && done !== 'kept') setOpen(false); // a kept answer stays open to show where it went
      onDone();
    }
  }
  return (
    <form onSubmit={submit} className="mt-2 flex w-full flex-col gap-2" noValidate>
      <label htmlFor={id} className={replyTo ? 'sr-only' : 'text-sm font-semibold'}>
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
      {kept && (
        <p role="status" className="notice text-sm">
          {kept} <a href="/pending">Changes waiting</a>
        </p>
      )}
      <p className="flex flex-wrap gap-2">
        <button type="submit" value="question" className="btn btn-quiet text-sm" disabled={busy}>
          {replyTo ? `Post ${label.toLowerCase()}` : 'Ask'}
        </button>
        {!replyTo && (
          <button type="submit" value="note" className="btn btn-quiet text-sm" disabled={busy}>
            Add as a note
          </button>
        )}
      </p>
    </form>
  );
}
