import { settings } from './config';
import { db } from './db/client';
import { seedDemoIfEmpty } from './demo/seed';

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
  })();
  return booting;
}

export function resetBootForTests(): void {
  booting = undefined;
}
