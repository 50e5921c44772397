// After a refused save (409): the sections that differ between my text and the one saved meanwhile come first,
// each with the words that differ marked, and for each a choice: keep mine, take theirs, or both. The section logic
// is in lib/record-sections.ts, the word logic in lib/record-diff.ts.
import { useEffect, useMemo, useRef, useState } from 'react';
import type { JSONContent } from '@tiptap/react';
import { diffDocs, diffTitles } from '~/lib/record-diff';
import {
  differingFirst,
  mergeSections,
  pairSections,
  splitSections,
  type DocNode,
  type SectionChoice,
  type SectionPair,
} from '~/lib/record-sections';
import DocChanges, { Pieces } from '../ui/DocChanges';

export interface ConflictTheirs {
  version: number;
  title: string;
  body: JSONContent;
  updatedBy: string | null;
}

const CHOICES: { value: SectionChoice; label: string }[] = [
  { value: 'mine', label: 'Keep mine' },
  { value: 'theirs', label: 'Take theirs' },
  { value: 'both', label: 'Merge both' },
];

/** A section's text without its heading, which the section's legend already shows. */
function sectionDoc(p: SectionPair, side: 'mine' | 'theirs') {
  const nodes = p[side]?.nodes ?? [];
  return { type: 'doc', content: p.title && nodes[0]?.type === 'heading' ? nodes.slice(1) : nodes };
}

export default function ConflictView({
  mine,
  theirs,
  onApply,
  onKeepMine,
  onTakeTheirs,
}: {
  mine: { title: string; body: JSONContent };
  theirs: ConflictTheirs;
  /** Puts the chosen text in the editor (not saved yet). */
  onApply: (result: { title: string; body: JSONContent }) => void;
  onKeepMine: () => void;
  onTakeTheirs: () => void;
}) {
  const pairs = useMemo(
    () =>
      pairSections(
        splitSections(mine.body as { content?: DocNode[] }),
        splitSections(theirs.body as { content?: DocNode[] }),
      ),
    [mine.body, theirs.body],
  );
  const ordered = differingFirst(pairs);
  const differing = ordered.filter((p) => !p.same);
  const alike = ordered.filter((p) => p.same);
  const titleDiffers = mine.title.trim() !== theirs.title.trim();
  const [choices, setChoices] = useState<Record<string, SectionChoice>>({});
  const [titleChoice, setTitleChoice] = useState<'mine' | 'theirs'>('mine');
  const heading = useRef<HTMLHeadingElement>(null);
  useEffect(() => {
    heading.current?.scrollIntoView({ block: 'start' });
    heading.current?.focus();
  }, []);
  const who = theirs.updatedBy ? ` by ${theirs.updatedBy}` : '';
  const name = (p: SectionPair) => p.title || 'Opening text';

  return (
    <section
      className="card flex flex-col gap-4 border-2 border-amber"
      aria-labelledby="conflict-h"
      data-testid="conflict-view"
    >
      <div>
        <h2 id="conflict-h" ref={heading} tabIndex={-1} className="scroll-mt-4 text-lg font-semibold">
          Version {theirs.version} was saved{who} while you edited
        </h2>
        <p className="text-sm">
          {differing.length === 0 && !titleDiffers
            ? 'Your text and theirs are the same; save again to keep it.'
            : `${[
                titleDiffers && 'the title',
                differing.length > 0 && `${differing.length} of ${pairs.length} sections`,
              ]
                .filter(Boolean)
                .join(' and ')} differ${differing.length + (titleDiffers ? 1 : 0) === 1 ? 's' : ''}: ${[
                titleDiffers ? 'Title' : null,
                ...differing.map(name),
              ]
                .filter(Boolean)
                .join(', ')}. Choose for each, then check the result in the editor and save.`}
        </p>
        <p className="mt-1 text-xs text-muted">
          <del className="rounded-sm bg-danger-soft line-through decoration-danger decoration-2">Struck</del> words are
          only in theirs,{' '}
          <ins className="rounded-sm bg-accent-soft underline decoration-accent decoration-2">underlined</ins> words
          only in yours.
        </p>
      </div>

      {titleDiffers && (
        <fieldset className="rounded-md border border-amber p-3" aria-describedby="conflict-title-diff">
          <legend className="px-1 font-semibold">Title</legend>
          <p id="conflict-title-diff" className="font-serif text-lg">
            <Pieces pieces={diffTitles(theirs.title, mine.title)} side="both" />
          </p>
          <div className="mt-2 flex flex-wrap gap-4 text-sm">
            {(['mine', 'theirs'] as const).map((v) => (
              <label key={v} className="flex items-center gap-1.5">
                <input
                  type="radio"
                  name="conflict-title"
                  value={v}
                  checked={titleChoice === v}
                  onChange={() => setTitleChoice(v)}
                />
                {v === 'mine' ? 'Keep mine' : 'Take theirs'}
              </label>
            ))}
          </div>
        </fieldset>
      )}

      {differing.map((p) => {
        const d = diffDocs(sectionDoc(p, 'theirs'), sectionDoc(p, 'mine'));
        const choice = choices[p.key] ?? (p.mine ? 'mine' : 'theirs');
        return (
          <fieldset key={p.key} className="min-w-0 rounded-md border border-amber p-3" data-section={name(p)}>
            <legend className="px-1 font-semibold">
              {name(p)}
              {!p.mine && ' (only in theirs)'}
              {!p.theirs && ' (only in yours)'}
            </legend>
            <div className="max-h-96 overflow-y-auto">
              <DocChanges blocks={d.blocks} beforeLabel={`Theirs (version ${theirs.version})`} afterLabel="Yours" />
            </div>
            <div className="mt-2 flex flex-wrap gap-4 text-sm">
              {CHOICES.map((c) => (
                <label key={c.value} className="flex items-center gap-1.5">
                  <input
                    type="radio"
                    name={`conflict-${p.key}`}
                    value={c.value}
                    checked={choice === c.value}
                    onChange={() => setChoices((x) => ({ ...x, [p.key]: c.value }))}
                  />
                  {c.label}
                </label>
              ))}
            </div>
          </fieldset>
        );
      })}

      <div className="flex flex-wrap gap-2">
        <button
          type="button"
          className="btn btn-primary"
          onClick={() =>
            onApply({
              title: titleChoice === 'mine' ? mine.title : theirs.title,
              body: mergeSections(pairs, choices),
            })
          }
        >
          Put these choices in the editor
        </button>
        <button type="button" className="btn btn-quiet" onClick={onKeepMine}>
          Save all of mine as the newer version
        </button>
        <button type="button" className="btn btn-quiet" onClick={onTakeTheirs}>
          Take all of theirs
        </button>
      </div>

      {alike.length > 0 && (
        <details className="text-sm">
          <summary className="cursor-pointer text-muted">
            {alike.length} section{alike.length === 1 ? ' is' : 's are'} the same in both
          </summary>
          <ul className="mt-1 list-disc pl-5">
            {alike.map((p) => (
              <li key={p.key}>{name(p)}</li>
            ))}
          </ul>
        </details>
      )}
      <p className="text-xs text-muted">Whichever you choose, every saved version stays in the record’s history.</p>
    </section>
  );
}
