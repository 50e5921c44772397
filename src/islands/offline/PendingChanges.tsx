import { useEffect, useState } from 'react';
import {
  changeText,
  discardChange,
  listChanges,
  onOutboxChange,
  recordOf,
  retryChange,
  sendWaiting,
  type OutboxEntry,
  type OutboxState,
} from '~/lib/client/outbox';

const STATE_WORDS: Record<OutboxState, string> = {
  waiting: 'Waiting to be sent',
  sending: 'Sending…',
  conflict: 'Needs you: changed meanwhile',
  failed: 'Needs you: not accepted',
};

/** The person's outbox: each change kept on this device, its state, and what can be done with it. */
export default function PendingChanges() {
  const [changes, setChanges] = useState<OutboxEntry[] | null>(null);
  const [online, setOnline] = useState(navigator.onLine);
  const [note, setNote] = useState('');

  useEffect(() => {
    const load = () => void listChanges().then(setChanges);
    const net = () => setOnline(navigator.onLine);
    load();
    onOutboxChange(load);
    window.addEventListener('online', net);
    window.addEventListener('offline', net);
    return () => {
      window.removeEventListener('online', net);
      window.removeEventListener('offline', net);
    };
  }, []);

  if (changes === null) return <p className="text-muted">Reading the changes kept in this browser…</p>;
  if (changes.length === 0)
    return (
      <p className="empty">
        Nothing waiting: every change you made has been sent. Anything you write with no network will be listed here
        until it is.
      </p>
    );

  const sendNow = async (entry?: OutboxEntry) => {
    setNote('');
    if (entry && entry.state === 'failed') await retryChange(entry.id);
    await sendWaiting();
  };
  const discard = async (entry: OutboxEntry) => {
    if (!window.confirm(`Discard “${entry.label}”? It has not been sent and cannot be brought back.`)) return;
    await discardChange(entry.id);
    setNote(`Discarded “${entry.label}”.`);
  };
  const copy = async (entry: OutboxEntry) => {
    try {
      await navigator.clipboard.writeText(changeText(entry));
      setNote(`The text of “${entry.label}” is copied.`);
    } catch {
      setNote('Copying is blocked in this browser; select the text below and copy it instead.');
    }
  };

  const waiting = changes.some((c) => c.state === 'waiting');
  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-center gap-3">
        <p className="text-sm" aria-live="polite">
          {online ? 'You are online.' : 'You are offline: these will be sent when the network is back.'}
        </p>
        {waiting && (
          <button type="button" className="btn btn-primary" disabled={!online} onClick={() => void sendNow()}>
            Send now
          </button>
        )}
      </div>
      {note && (
        <p role="status" className="rounded bg-accent-soft px-3 py-2 text-sm">
          {note}
        </p>
      )}
      <ol className="flex flex-col gap-3" aria-label="Changes kept on this device, oldest first">
        {changes.map((c) => {
          const recordId = recordOf(c);
          const needs = c.state === 'conflict' || c.state === 'failed';
          return (
            <li key={c.id} className="card flex flex-col gap-2" data-outbox-entry={c.state}>
              <p className="font-semibold">{c.label}</p>
              <p className="text-sm text-muted">
                Made <time dateTime={c.createdAt}>{new Date(c.createdAt).toLocaleString()}</time> ·{' '}
                <span className={needs ? 'font-semibold text-danger' : ''}>{STATE_WORDS[c.state]}</span>
              </p>
              {c.message && <p className={needs ? 'alert text-sm' : 'text-sm'}>{c.message}</p>}
              {c.state === 'failed' && (
                <details className="text-sm">
                  <summary className="cursor-pointer">Show the text</summary>
                  <pre className="mt-2 whitespace-pre-wrap rounded bg-sunken p-2 font-sans">{changeText(c)}</pre>
                </details>
              )}
              <p className="flex flex-wrap gap-2">
                {c.state === 'conflict' && recordId && (
                  <a className="btn btn-primary" href={`/records/${encodeURIComponent(recordId)}/edit?outbox=${c.id}`}>
                    Resolve
                  </a>
                )}
                {(c.state === 'waiting' || c.state === 'failed') && (
                  <button type="button" className="btn btn-quiet" disabled={!online} onClick={() => void sendNow(c)}>
                    {c.state === 'failed' ? 'Try again' : 'Send now'}
                  </button>
                )}
                {needs && (
                  <button type="button" className="btn btn-quiet" onClick={() => void copy(c)}>
                    Copy the text
                  </button>
                )}
                <button type="button" className="btn btn-danger" onClick={() => void discard(c)}>
                  Discard
                </button>
              </p>
            </li>
          );
        })}
      </ol>
    </div>
  );
}
