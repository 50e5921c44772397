import { useEffect, useImperativeHandle, useState, type KeyboardEvent, type Ref } from 'react';
import useSWR from 'swr';
import { fetcher } from '~/lib/client/api';
import type { SearchResponse, SearchType } from '~/lib/search-types';
import { searchKey } from './keys';
import { HitMeta } from './HitMeta';

const LIMIT = 7;

export interface ResultsHandle {
  /** Arrow keys and Enter, forwarded from the search field. */
  onKeyDown(e: KeyboardEvent<HTMLInputElement>): void;
}

interface Props {
  ref?: Ref<ResultsHandle>;
  query: string;
  type: SearchType | '';
  listId: string;
  idPrefix: string;
  allHref: string;
  visible: boolean;
  onActiveId: (id: string | undefined) => void;
}

/** The listbox under the header's search field: results as you type (SWR), then a link to all results. */
export default function SearchResults({ ref, query, type, listId, idPrefix, allHref, visible, onActiveId }: Props) {
  const key = query ? searchKey({ q: query, type, limit: LIMIT }) : null;
  const { data, error, isLoading } = useSWR<SearchResponse, Error>(key, fetcher, {
    keepPreviousData: true,
    revalidateOnFocus: false,
  });
  const hits = query && data ? data.hits : [];
  const count = hits.length + (query ? 1 : 0); // the last option opens the results page
  // The highlighted option belongs to the answer it was chosen in; a new answer starts with none.
  const [chosen, setChosen] = useState({ key, index: -1 });
  const active = chosen.key === key ? chosen.index : -1;
  const optionId = (i: number) => `${idPrefix}-option-${i}`;

  function choose(index: number) {
    setChosen({ key, index });
    onActiveId(index >= 0 ? optionId(index) : undefined);
  }

  useImperativeHandle(ref, () => ({
    onKeyDown(e) {
      if (e.key === 'ArrowDown' || e.key === 'ArrowUp') {
        e.preventDefault();
        if (count === 0) return;
        const next = active + (e.key === 'ArrowDown' ? 1 : -1);
        // Past either end goes back to the text field, as in a native list of suggestions.
        choose(next >= count ? -1 : next < -1 ? count - 1 : next);
      } else if (e.key === 'Enter' && active >= 0) {
        e.preventDefault();
        window.location.assign(active < hits.length ? hits[active].url : allHref);
      }
    },
  }));

  useEffect(() => {
    if (active >= 0) document.getElementById(optionId(active))?.scrollIntoView({ block: 'nearest' });
  }, [active]); // eslint-disable-line react-hooks/exhaustive-deps

  const status = !query
    ? ''
    : error
      ? 'Search is not answering right now; press Enter for the results page.'
      : data
        ? data.hits.length === 0
          ? `No results for “${query}”.`
          : `${data.totalCapped ? `More than ${data.total}` : data.total} result${data.total === 1 ? '' : 's'}.`
        : 'Searching…';

  return (
    <>
      <p className="sr-only" role="status" aria-live="polite">
        {visible ? status : ''}
      </p>
      {data && data.corrections.length > 0 && hits.length > 0 && (
        <p className="px-2 pb-1 text-xs text-muted">
          Showing results for {data.corrections.map((c) => `“${c.to[0]}”`).join(', ')} (you typed{' '}
          {data.corrections.map((c) => `“${c.from}”`).join(', ')}).
        </p>
      )}
      <div
        role="listbox"
        id={listId}
        aria-label="Search results"
        className="flex max-h-[70vh] flex-col overflow-y-auto [&_mark]:rounded-sm [&_mark]:bg-amber-soft [&_mark]:text-ink"
      >
        {hits.map((h, i) => (
          <a
            key={`${h.type}:${h.id}`}
            id={optionId(i)}
            role="option"
            aria-selected={active === i}
            tabIndex={-1}
            href={h.url}
            onMouseMove={() => active !== i && choose(i)}
            className={`block rounded-md px-2 py-1.5 text-ink no-underline ${active === i ? 'bg-accent-soft' : ''}`}
          >
            <span className="block text-sm font-semibold" dangerouslySetInnerHTML={{ __html: h.titleHtml }} />
            <HitMeta hit={h} className="block text-xs text-muted" />
            {h.snippet && (
              <span className="mt-0.5 line-clamp-2 block text-xs" dangerouslySetInnerHTML={{ __html: h.snippet }} />
            )}
          </a>
        ))}
        {query && (
          <a
            id={optionId(hits.length)}
            role="option"
            aria-selected={active === hits.length}
            tabIndex={-1}
            href={allHref}
            onMouseMove={() => active !== hits.length && choose(hits.length)}
            className={`block rounded-md px-2 py-1.5 text-sm font-semibold ${active === hits.length ? 'bg-accent-soft' : ''}`}
          >
            {hits.length === 0
              ? isLoading
                ? 'Searching…'
                : `No quick results: open the results page for “${query}”`
              : `All results for “${query}”`}
          </a>
        )}
      </div>
    </>
  );
}
