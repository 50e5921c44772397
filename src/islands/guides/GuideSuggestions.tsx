import { useState, type FormEvent } from 'react';
import useSWR, { mutate as revalidate } from 'swr';
import { apiFetch, ApiError, fetcher } from '~/lib/client/api';
import type { GuideSuggestion } from '~/lib/schemas/guides';
import type { SuggestionState } from '~/lib/domain';

const STATE_WORDS: Record<SuggestionState, string> = { open: 'Open', done: 'Done', declined: 'Declined' };

/**
 * Anyone signed in suggests a change to a guide (a section and a text); advisors and leads also see the guide's
 * suggestions and mark them done or declined.
 */
export default function GuideSuggestions({
  slug,
  sections,
  canTriage,
}: {
  slug: string;
  sections: string[];
  canTriage: boolean;
}) {
  return (
    <div className="flex flex-col gap-6">
      <SuggestForm slug={slug} sections={sections} />
      {canTriage && <SuggestionList slug={slug} />}
    </div>
  );
}

function SuggestForm({ slug, sections }: { slug: string; sections: string[] }) {
  const [section, setSection] = useState('');
  const [body, setBody] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<{ tone: 'ok' | 'error'; text: string } | null>(null);
  const [busy, setBusy] = useState(false);
  async function submit(e: FormEvent) {
    e.preventDefault();
    setErrors({});
    setMessage(null);
    setBusy(true);
    try {
      await apiFetch(`/api/guides/${slug}/suggestions`, {
        method: 'POST',
        json: { body, ...(section ? { section } : {}) },
      });
      setBody('');
      setMessage({ tone: 'ok', text: 'Thank you: an advisor or lead will read your suggestion.' });
      // An advisor's list on the same page shows the new suggestion at once.
      await revalidate((k) => typeof k === 'string' && k.startsWith(`/api/guides/${slug}/suggestions`));
    } catch (err) {
      if (err instanceof ApiError) {
        setErrors(err.fieldErrors());
        setMessage({ tone: 'error', text: err.status === 400 ? 'Some fields need attention.' : err.message });
      } else setMessage({ tone: 'error', text: 'Could not reach the server; try again.' });
    } finally {
      setBusy(false);
    }
  }
  return (
    <form onSubmit={submit} className="flex flex-col gap-3" noValidate aria-labelledby="suggest-h">
      <h2 id="suggest-h" className="text-lg font-semibold">
        Suggest a change
      </h2>
      <p className="text-sm text-muted">
        Something wrong, missing or out of date? Say what should change; the guide’s maintainers edit the text.
      </p>
      <div className="field max-w-md">
        <label htmlFor="suggest-section">Section</label>
        <select
          id="suggest-section"
          className="input"
          value={section}
          onChange={(e) => setSection(e.target.value)}
          aria-invalid={errors.section ? true : undefined}
          aria-describedby={errors.section ? 'suggest-section-error' : undefined}
        >
          <option value="">The guide as a whole</option>
          {sections.map((s) => (
            <option key={s} value={s}>
              {s}
            </option>
          ))}
        </select>
        {errors.section && (
          <p id="suggest-section-error" className="field-error">
            {errors.section}
          </p>
        )}
      </div>
      <div className="field">
        <label htmlFor="suggest-body">What should change</label>
        <textarea
          id="suggest-body"
          className="input min-h-24"
          value={body}
          maxLength={4000}
          onChange={(e) => setBody(e.target.value)}
          aria-invalid={errors.body ? true : undefined}
          aria-describedby={errors.body ? 'suggest-body-error' : undefined}
        />
        {errors.body && (
          <p id="suggest-body-error" className="field-error">
            {errors.body}
          </p>
        )}
      </div>
      <div className="flex flex-wrap items-center gap-3">
        <button type="submit" className="btn btn-primary" disabled={busy}>
          {busy ? 'Sending…' : 'Send suggestion'}
        </button>
        {message && (
          <p
            className={message.tone === 'ok' ? 'text-sm' : 'field-error'}
            role={message.tone === 'ok' ? 'status' : 'alert'}
          >
            {message.text}
          </p>
        )}
      </div>
    </form>
  );
}

function SuggestionList({ slug }: { slug: string }) {
  const [state, setState] = useState<SuggestionState>('open');
  const key = `/api/guides/${slug}/suggestions?state=${state}`;
  const list = useSWR<{ suggestions: GuideSuggestion[] }, Error>(key, fetcher);
  const { data, isLoading, mutate } = list;
  const failedToLoad = !!list.error;
  const [failure, setFailure] = useState('');
  async function decide(id: string, next: SuggestionState) {
    setFailure('');
    try {
      await apiFetch(`/api/guides/suggestions/${id}`, { method: 'PATCH', json: { state: next } });
      await mutate();
    } catch (e) {
      setFailure(e instanceof ApiError ? e.message : 'Could not reach the server; try again.');
    }
  }
  return (
    <section aria-labelledby="suggestions-h" className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <h2 id="suggestions-h" className="text-lg font-semibold">
          Suggestions for this guide
        </h2>
        <div className="field">
          <label htmlFor="suggestions-state">Show</label>
          <select
            id="suggestions-state"
            className="input py-1"
            value={state}
            onChange={(e) => setState(e.target.value as SuggestionState)}
          >
            {(Object.keys(STATE_WORDS) as SuggestionState[]).map((s) => (
              <option key={s} value={s}>
                {STATE_WORDS[s]}
              </option>
            ))}
          </select>
        </div>
      </div>
      {isLoading && <p className="text-sm text-muted">Loading the suggestions…</p>}
      {failedToLoad && (
        <p className="field-error" role="alert">
          Could not load the suggestions.
        </p>
      )}
      {data && data.suggestions.length === 0 && (
        <p className="empty">No {STATE_WORDS[state].toLowerCase()} suggestions for this guide.</p>
      )}
      {failure && (
        <p className="field-error" role="alert">
          {failure}
        </p>
      )}
      <ul className="flex flex-col gap-3">
        {data?.suggestions.map((s) => (
          <li key={s.id} className="rounded-lg border border-line p-3 text-sm">
            <p className="text-muted">
              {s.section ? <>On “{s.section}”</> : 'On the guide as a whole'} · {s.author ?? 'A former member'},{' '}
              <time dateTime={s.createdAt}>{s.createdAt.slice(0, 10)}</time>
              {s.decidedBy && (
                <>
                  {' '}
                  · {STATE_WORDS[s.state].toLowerCase()} by {s.decidedBy}
                </>
              )}
            </p>
            <p className="mt-1 whitespace-pre-wrap">{s.body}</p>
            <div className="mt-2 flex flex-wrap gap-2">
              {s.state !== 'done' && (
                <button type="button" className="btn btn-quiet py-1 text-sm" onClick={() => decide(s.id, 'done')}>
                  Mark done
                </button>
              )}
              {s.state !== 'declined' && (
                <button type="button" className="btn btn-quiet py-1 text-sm" onClick={() => decide(s.id, 'declined')}>
                  Decline
                </button>
              )}
              {s.state !== 'open' && (
                <button type="button" className="btn btn-quiet py-1 text-sm" onClick={() => decide(s.id, 'open')}>
                  Open again
                </button>
              )}
            </div>
          </li>
        ))}
      </ul>
    </section>
  );
}
