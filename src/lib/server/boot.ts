import { settings } from './config';
import { db } from './db/client';
import { seedDemoIfEmpty } from './demo/seed';
import { warmSearch } from './search';

let booting: Promise<void> | undefined;

/**
 * Validates settings, opens the database (applying migrations) and seeds the demo when asked.
 * Runs once per process; the server entry calls it before listening and every request awaits the same promise.
 */
export function ensureBooted(): Promise<void> {
  booting ??= (async () => {
    const s = settings();
    db();
    if (s.WAKEBOOK_DEMO) await seedDemoIfEmpty();
    // Not awaited: the server listens while guides are indexed and the vocabulary loads.
    void warmSearch();
  })();
  return booting;
}

export function resetBootForTests(): void {
  booting = undefined;
}
