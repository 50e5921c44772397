import type { SearchType } from '~/lib/search-types';

interface SearchState {
  q: string;
  type?: SearchType | '';
  subsystem?: string;
  season?: string;
  limit?: number;
  offset?: number;
}

function params(s: SearchState): URLSearchParams {
  const p = new URLSearchParams({ q: s.q });
  if (s.type) p.set('type', s.type);
  if (s.subsystem) p.set('subsystem', s.subsystem);
  if (s.season) p.set('season', s.season);
  if (s.limit) p.set('limit', String(s.limit));
  if (s.offset) p.set('offset', String(s.offset));
  return p;
}

/** The SWR key (and URL) of a search. */
export const searchKey = (s: SearchState) => `/api/search?${params(s)}`;

/** The full results page for a search. */
export const resultsHref = (s: SearchState) => `/search?${params(s)}`;
