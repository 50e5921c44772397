// Runs on every page (BaseLayout): keeps what the browser stores for reading offline to the person the page was
// rendered for, registers the service worker for a signed-in person, and shows the age of a kept page.
import { belongsToSomeoneElse, type FromWorker, type ToWorker } from '../offline/names';

/** Deletes every cache and IndexedDB database of ours that is not `person`'s (everything, for nobody). */
export async function forgetAllBut(person: string): Promise<void> {
  if ('caches' in window) {
    const names = await caches.keys();
    await Promise.all(names.filter((n) => belongsToSomeoneElse(n, person)).map((n) => caches.delete(n)));
  }
  if ('indexedDB' in window && 'databases' in indexedDB) {
    const dbs = await indexedDB.databases();
    for (const { name } of dbs) {
      if (name && belongsToSomeoneElse(name, person)) indexedDB.deleteDatabase(name);
    }
  }
}

const ago = (iso: string): string => {
  const minutes = Math.round((Date.now() - Date.parse(iso)) / 60000);
  const words = new Intl.RelativeTimeFormat('en', { numeric: 'auto' });
  if (minutes < 1) return 'a moment ago';
  if (minutes < 60) return words.format(-minutes, 'minute');
  if (minutes < 48 * 60) return words.format(-Math.round(minutes / 60), 'hour');
  return words.format(-Math.round(minutes / 1440), 'day');
};

function showAge(keptAt: string): void {
  const spot = document.getElementById('offline-status');
  if (!spot || !keptAt) return;
  const note = document.createElement('p');
  note.className = 'offline-age mt-3 rounded-md border border-line bg-sunken px-3 py-2 text-sm text-muted';
  note.dataset.keptAt = keptAt;
  const when = document.createElement('time');
  when.dateTime = keptAt;
  when.textContent = ago(keptAt);
  note.append(
    navigator.onLine ? 'The network did not answer in time' : 'You are offline',
    ' — this page was kept ',
    when,
    '.',
  );
  spot.append(note);
  spot.hidden = false;
}

export async function startOffline(): Promise<void> {
  const root = document.documentElement;
  if (root.hasAttribute('data-offline-page')) return; // the offline page belongs to nobody
  const person = root.dataset.person ?? '';
  await forgetAllBut(person);
  if (!('serviceWorker' in navigator)) return;
  if (!person) {
    navigator.serviceWorker.controller?.postMessage({ type: 'forget' } satisfies ToWorker);
    return;
  }
  navigator.serviceWorker.addEventListener('message', (event: MessageEvent<FromWorker>) => {
    if (event.data?.type === 'kept') showAge(event.data.keptAt);
  });
  await navigator.serviceWorker.register('/sw.js', { scope: '/' });
  const ready = await navigator.serviceWorker.ready;
  const to = navigator.serviceWorker.controller ?? ready.active;
  to?.postMessage({ type: 'person', person } satisfies ToWorker);
}
