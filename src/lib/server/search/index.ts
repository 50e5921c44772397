// The app's search: one engine over the app's database, told about every record and calculation write through the
// change hooks, with the guides of this build in its index. Importing this module registers the hooks; boot.ts
// imports it, so they are in place before the first request can write.
import { db } from '../db/client';
import { onCalculationChangedListen, onRecordChangedListen } from '../records/hooks';
import { listSeasons } from '../seasons';
import { SearchEngine, type SearchParams } from './engine';
import { fingerprint, loadGuideDocs } from './guides';
import type { SearchQuery, SearchResponse } from '../../schemas/search';

let engine: SearchEngine | null = null;
let engineClient: unknown = null;
let guidesReady: Promise<void> | null = null;

/** The engine for the current database (tests may close and reopen it). */
function currentEngine(): SearchEngine {
  const client = db().$client;
  if (!engine || engineClient !== client) {
    engine = new SearchEngine(client);
    engineClient = client;
    guidesReady = null;
  }
  return engine;
}

function ensureGuides(e: SearchEngine): Promise<void> {
  guidesReady ??= loadGuideDocs()
    .then((guides) => {
      e.replaceGuides(guides, fingerprint(guides));
    })
    .catch((err) => {
      guidesReady = null; // try again on the next search
      throw err;
    });
  return guidesReady;
}

onRecordChangedListen((id) => {
  if (engine && engineClient === db().$client) engine.noteChanged('record', id);
});
onCalculationChangedListen((id) => {
  if (engine && engineClient === db().$client) engine.noteChanged('calculation', id);
});

/**
 * Indexes the guides and loads the vocabulary after boot, so the first search rarely waits. Failures are logged,
 * not thrown: search then retries on its first request.
 */
export function warmSearch(): Promise<void> {
  const e = currentEngine();
  return Promise.all([ensureGuides(e), e.loadVocabulary()])
    .then(() => undefined)
    .catch((err) => console.error('[wakebook] preparing search failed:', err));
}

/** A season filter may name the season ("2025–26") or give its id. */
function seasonIdFor(season: string | undefined): string | undefined {
  if (!season) return undefined;
  const all = listSeasons();
  return (all.find((s) => s.id === season) ?? all.find((s) => s.name === season))?.id ?? season;
}

export async function searchEverything(query: SearchQuery): Promise<SearchResponse> {
  const started = performance.now();
  const e = currentEngine();
  await ensureGuides(e);
  const params: SearchParams = {
    q: query.q,
    type: query.type || undefined,
    subsystem: query.subsystem || undefined,
    seasonId: seasonIdFor(query.season),
    limit: query.limit,
    offset: query.offset,
  };
  const result = await e.search(params);
  return { ...result, tookMs: Math.round((performance.now() - started) * 100) / 100 };
}
