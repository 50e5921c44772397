// What the production start file (scripts/start.mjs) runs before it listens: the settings are validated (a bad one
// stops the process with its name), the committed migrations are applied and, with WAKEBOOK_DEMO=1, the demo team is
// seeded into an empty database. Bundled on its own into dist/prepare/ at build time (integrations/prepare-bundle.mjs)
// because it must run before the Astro app is loaded; the app opens its own connection afterwards.
import { settings, type Settings } from './config';
import { closeDatabase, db } from './db/client';
import { removeStaleIncoming } from './storage';

/**
 * Validates the settings, opens the database (applying migrations), removes uploads a stopped process left half
 * written, and seeds the demo when asked and empty.
 */
export async function openAndSeed(): Promise<Settings> {
  const s = settings();
  const d = db();
  const stale = removeStaleIncoming();
  if (stale > 0) console.info(`[wakebook] removed ${stale} unfinished upload(s) left by an earlier run`);
  // The seed brings the server-side editor schema (about half a second to load): import it only when needed.
  if (s.WAKEBOOK_DEMO && !d.$client.prepare('select 1 from users limit 1').get()) {
    await (await import('./demo/seed')).seedDemoIfEmpty();
  }
  return s;
}

/** openAndSeed() for the start file, which then hands the database to the app. */
export async function prepare(): Promise<Settings> {
  try {
    return await openAndSeed();
  } finally {
    closeDatabase();
  }
}
