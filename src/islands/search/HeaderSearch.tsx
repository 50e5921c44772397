import { lazy, Suspense, useEffect, useId, useRef, useState, type FocusEvent, type KeyboardEvent } from 'react';
import { SEARCH_TYPE_LABELS, SEARCH_TYPES, type SearchType } from '~/lib/search-types';
import { resultsHref } from './keys';
import type { ResultsHandle } from './SearchResults';

// The results code (SWR, the list) loads when the field is first used, so the header costs every page only this
// file: pages without other islands stay within their JavaScript budget.
const SearchResults = lazy(() => import('./SearchResults'));

const DEBOUNCE_MS = 150;

/**
 * The search field in the header. Server-rendered it is a plain GET form to /search, so it works without
 * JavaScript; hydrated it shows results as you type (ARIA combobox with a listbox of results): arrows move,
 * Enter opens the highlighted result (or the results page), Escape closes, and Escape again clears.
 */
export default function HeaderSearch({ initialQuery = '' }: { initialQuery?: string }) {
  const [text, setText] = useState(initialQuery);
  const [query, setQuery] = useState(initialQuery.trim());
  const [type, setType] = useState<SearchType | ''>('');
  const [open, setOpen] = useState(false);
  const [wanted, setWanted] = useState(false);
  const [activeId, setActiveId] = useState<string | undefined>();
  const inputRef = useRef<HTMLInputElement>(null);
  const results = useRef<ResultsHandle>(null);
  const id = useId();
  const listId = `${id}-results`;

  // Text typed before this island hydrated is in the DOM only: adopt it.
  useEffect(() => {
    const typed = inputRef.current?.value ?? '';
    if (typed !== initialQuery) {
      setText(typed);
      setQuery(typed.trim());
      setWanted(true);
      setOpen(typed.trim().length > 0 && document.activeElement === inputRef.current);
    }
  }, [initialQuery]);

  useEffect(() => {
    const t = setTimeout(() => setQuery(text.trim()), DEBOUNCE_MS);
    return () => clearTimeout(t);
  }, [text]);

  const showList = open && text.trim().length > 0;

  function close() {
    setOpen(false);
    setActiveId(undefined);
  }

  function onKeyDown(e: KeyboardEvent<HTMLInputElement>) {
    if (e.key === 'Escape') {
      if (showList) {
        e.preventDefault();
        close();
      } else if (text) {
        e.preventDefault();
        setText('');
      }
    } else if (e.key === 'ArrowDown' && !showList && text.trim()) {
      e.preventDefault();
      setOpen(true);
    } else if (showList) results.current?.onKeyDown(e);
  }

  function onBlur(e: FocusEvent<HTMLFormElement>) {
    if (!e.currentTarget.contains(e.relatedTarget)) close();
  }

  const emptyList = <div role="listbox" id={listId} aria-label="Search results" />;

  return (
    <form
      action="/search"
      method="get"
      role="search"
      className="relative order-last w-full sm:order-none sm:ml-auto sm:w-80"
      onBlur={onBlur}
      onPointerEnter={() => setWanted(true)}
    >
      <label htmlFor="site-search" className="sr-only">
        Search everything
      </label>
      <input
        ref={inputRef}
        id="site-search"
        name="q"
        type="search"
        value={text}
        placeholder="Search  ( / )"
        autoComplete="off"
        spellCheck={false}
        maxLength={500}
        className="input py-1.5 text-sm"
        data-search-shortcut=""
        role="combobox"
        aria-expanded={showList}
        aria-controls={listId}
        aria-autocomplete="list"
        aria-activedescendant={showList ? activeId : undefined}
        onChange={(e) => {
          setText(e.target.value);
          setOpen(true);
          setActiveId(undefined);
        }}
        onFocus={() => {
          setWanted(true);
          if (text.trim()) setOpen(true);
        }}
        onKeyDown={onKeyDown}
      />
      {type && <input type="hidden" name="type" value={type} />}
      <div
        hidden={!showList}
        className="absolute right-0 z-30 mt-1 w-[min(36rem,calc(100vw-2rem))] rounded-lg border border-line bg-surface p-2 shadow-lg"
      >
        <div role="group" aria-label="Show only" className="mb-2 flex flex-wrap gap-1.5">
          {(['', ...SEARCH_TYPES] as const).map((t) => (
            <button
              key={t || 'all'}
              type="button"
              aria-pressed={type === t}
              onClick={() => {
                setType(t);
                setActiveId(undefined);
                inputRef.current?.focus();
              }}
              className={`rounded-full border px-2.5 py-0.5 text-xs font-semibold ${type === t ? 'border-accent bg-accent-soft text-accent-strong' : 'border-line text-muted hover:bg-sunken'}`}
            >
              {t ? SEARCH_TYPE_LABELS[t] : 'Everything'}
            </button>
          ))}
        </div>
        {wanted ? (
          <Suspense fallback={emptyList}>
            <SearchResults
              ref={results}
              query={query}
              type={type}
              listId={listId}
              idPrefix={id}
              allHref={resultsHref({ q: text.trim(), type })}
              visible={showList}
              onActiveId={setActiveId}
            />
          </Suspense>
        ) : (
          emptyList
        )}
      </div>
    </form>
  );
}
