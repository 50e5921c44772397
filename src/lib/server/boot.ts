import { settings } from './config';
import { db } from './db/client';
import { warmSearch } from './search';

let booting: Promise<void> | undefined;

/**
 * Validates settings, opens the database (applying migrations) and seeds the demo when asked.
 * Runs once per process; the server entry calls it before listening and every request awaits the same promise.
 */
export function ensureBooted(): Promise<void> {
  booting ??= (async () => {
    const s = settings();
    const d = db();
    // The seed brings the server-side editor schema (about half a second to load): only import it when the
    // demo is asked for and the database is still empty, so a restart answers sooner.
    if (s.WAKEBOOK_DEMO && !d.$client.prepare('select 1 from users limit 1').get()) {
      await (await import('./demo/seed')).seedDemoIfEmpty();
    }
    // Not awaited: the server listens while guides are indexed and the vocabulary loads.
    void warmSearch();
  })();
  return booting;
}
