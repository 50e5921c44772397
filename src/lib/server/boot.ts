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
    // Not awaited: the server answers while guides are indexed and the vocabulary loads.
    void warmSearch();
  })();
  return booting;
}
