// The indicator itself, loaded by outbox-status.ts once there is something kept: sends the waiting changes now and
// whenever the network comes back, and says calmly where things stand.
import { isSending, listChanges, onOutboxChange, sendWaiting, type OutboxEntry } from './outbox';

const RETRY_MS = 20_000;
const QUIET_AFTER_MS = 5000;
const plural = (n: number) => (n === 1 ? '1 change' : `${n} changes`);

/** The indicator's words for the changes kept, or '' when there is nothing to say. */
export function outboxWords(changes: OutboxEntry[], online: boolean, sending: boolean): string {
  const needs = changes.filter((c) => c.state === 'conflict' || c.state === 'failed').length;
  const waiting = changes.length - needs;
  if (needs > 0) return `${needs === 1 ? '1 change needs' : `${needs} changes need`} you`;
  if (waiting === 0) return '';
  if (!online) return `Offline — ${plural(waiting)} kept`;
  return sending ? 'Sending…' : `${plural(waiting)} waiting to be sent`;
}

export function runIndicator(spot: HTMLElement): void {
  let hadWaiting = false;
  let quietTimer = 0;
  let retryTimer = 0;
  const show = (text: string, tone: string) => {
    spot.textContent = text;
    spot.dataset.tone = tone;
    spot.hidden = text === '';
  };
  const render = async () => {
    const changes = await listChanges();
    const text = outboxWords(changes, navigator.onLine, isSending());
    // Online but a send did not get through (the server was away): try again a little later.
    if (navigator.onLine && !retryTimer && changes.some((c) => c.state === 'waiting'))
      retryTimer = window.setTimeout(() => {
        retryTimer = 0;
        void sendWaiting();
      }, RETRY_MS);
    if (text) {
      window.clearTimeout(quietTimer);
      hadWaiting = true;
      show(text, needsYou(changes) ? 'needs' : 'waiting');
    } else if (hadWaiting) {
      // Everything went: say so briefly, then go quiet (a later empty render leaves the note to its timer).
      hadWaiting = false;
      show('All changes sent', 'done');
      quietTimer = window.setTimeout(() => show('', ''), QUIET_AFTER_MS);
    }
  };
  onOutboxChange(() => void render());
  window.addEventListener('online', () => void sendWaiting());
  window.addEventListener('offline', () => void render());
  void render().then(() => sendWaiting());
}

const needsYou = (changes: OutboxEntry[]) => changes.some((c) => c.state === 'conflict' || c.state === 'failed');
