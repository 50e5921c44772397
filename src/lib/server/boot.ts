import { openAndSeed } from './prepare';
import { warmSearch } from './search';

let booting: Promise<void> | undefined;

/**
 * Opens the database and seeds the demo when asked (the start file has done both before listening; the dev server
 * and the tests have no start file), then warms search. Runs once per process; every request awaits the same promise.
 */
export function ensureBooted(): Promise<void> {
  booting ??= (async () => {
    await openAndSeed();
    // Files an import was still converting when the server stopped go back in the queue. Not awaited: the
    // converters (HTML parsing, the editor's schema) load beside the first answers, not before them.
    void import('./imports/queue').then(({ resumeImports }) => {
      const waiting = resumeImports();
      if (waiting > 0) console.info(`[wakebook] resumed ${waiting} file(s) of unfinished imports`);
    });
    // Not awaited: the server answers while guides are indexed and the vocabulary loads.
    void warmSearch();
  })();
  return booting;
}
