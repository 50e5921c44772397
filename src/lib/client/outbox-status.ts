// The header's outbox indicator, on every signed-in page. Kept tiny: the IndexedDB code (outbox-indicator.ts and the
// outbox) loads only when the person has changes kept, or keeps one on this page. Also warns before a sign-out
// would delete unsent changes (signing out clears everything this browser kept for the person).
import { OUTBOX_CHANGED, hintKey, readHint } from './api';

export function startOutboxStatus(): void {
  const spot = document.getElementById('outbox-status');
  if (!spot || !document.documentElement.dataset.person) return;
  let started: Promise<void> | null = null;
  const wake = () => {
    started ??= import('./outbox-indicator').then((m) => m.runIndicator(spot));
  };
  if (readHint() > 0) wake();
  window.addEventListener(OUTBOX_CHANGED, wake);
  window.addEventListener('storage', (e) => {
    if (e.key === hintKey()) wake();
  });
  window.addEventListener('online', () => {
    if (readHint() > 0) wake();
  });

  for (const form of document.querySelectorAll<HTMLFormElement>('form[action="/sign-out"]')) {
    form.addEventListener('submit', (e) => {
      const n = readHint();
      const ask = `${n === 1 ? '1 change is' : `${n} changes are`} not sent yet; signing out deletes them. Sign out anyway?`;
      if (n > 0 && !window.confirm(ask)) e.preventDefault();
    });
  }
}
