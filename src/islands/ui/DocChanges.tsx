// Renders a record-diff (lib/record-diff.ts): unchanged blocks once across the width, changed blocks split into the
// older text (deletions struck through) beside the newer one (insertions underlined), both highlighted in place.
// Used without hydration on the history page (no JavaScript shipped) and inside the editor's conflict view.
import type { ReactNode } from 'react';
import type { Block, BlockChange, Mark, Piece } from '~/lib/record-diff';
import { isSafeHref } from '~/lib/editor/links';

function withMarks(text: string, marks: Mark[]): ReactNode {
  let out: ReactNode = text;
  for (const m of marks) {
    if (m.type === 'bold') out = <strong>{out}</strong>;
    else if (m.type === 'italic') out = <em>{out}</em>;
    else if (m.type === 'strike') out = <s>{out}</s>;
    else if (m.type === 'underline') out = <u>{out}</u>;
    else if (m.type === 'code') out = <code>{out}</code>;
    else if (m.type === 'link' && isSafeHref(m.attrs?.href)) out = <a href={m.attrs.href}>{out}</a>;
  }
  return out;
}

const INS = 'rounded-sm bg-accent-soft text-ink underline decoration-accent decoration-2 underline-offset-2';
const DEL = 'rounded-sm bg-danger-soft text-ink line-through decoration-danger decoration-2';
const MARKED = 'rounded-sm outline outline-1 outline-dashed outline-amber';

/** The pieces of one side: `side` 'before' keeps deletions, 'after' keeps insertions, 'both' keeps both inline. */
export function Pieces({ pieces, side }: { pieces: Piece[]; side: 'before' | 'after' | 'both' }) {
  return (
    <>
      {pieces.map((p, i) => {
        if (p.op === 'ins' && side === 'before') return null;
        if (p.op === 'del' && side === 'after') return null;
        const body = withMarks(p.text, side === 'before' && p.oldMarks ? p.oldMarks : p.marks);
        if (p.op === 'ins')
          return (
            <ins key={i} className={INS}>
              <span className="sr-only">[added] </span>
              {body}
            </ins>
          );
        if (p.op === 'del')
          return (
            <del key={i} className={DEL}>
              <span className="sr-only">[removed] </span>
              {body}
            </del>
          );
        if (p.markChange && side !== 'before') {
          const what = [
            ...p.markChange.after.map((m) => `${m} added`),
            ...p.markChange.before.map((m) => `${m} removed`),
          ].join(', ');
          return (
            <span key={i} className={MARKED} title={`Formatting: ${what}`} data-change="marks">
              {body}
              <span className="sr-only"> [formatting: {what}]</span>
            </span>
          );
        }
        return <span key={i}>{body}</span>;
      })}
    </>
  );
}

function listPrefix(b: Block): string {
  const l = b.lists[b.lists.length - 1];
  if (!l) return '';
  if (l.type === 'task') return l.checked ? '☑ ' : '☐ ';
  return l.type === 'ordered' ? `${l.number ?? 1}. ` : '• ';
}

/** One block with its shape (heading, list item, quote, code) and the pieces to show in it. */
function BlockText({ block, children }: { block: Block; children: ReactNode }) {
  const indent = { paddingLeft: `${block.lists.length * 1.25}rem` };
  const quote = block.quote ? 'border-l-4 border-line pl-3 italic' : '';
  if (block.kind === 'rule') return <hr className="my-2 border-line" />;
  if (block.kind === 'heading')
    return (
      <p
        className={`mt-3 font-serif font-semibold ${block.level === 2 ? 'text-xl' : 'text-lg'} ${quote}`}
        style={indent}
      >
        {children}
      </p>
    );
  if (block.kind === 'code')
    return (
      <pre className={`whitespace-pre-wrap break-words rounded bg-sunken p-2 text-sm ${quote}`} style={indent}>
        {children}
      </pre>
    );
  return (
    <p className={`whitespace-pre-line break-words ${quote}`} style={indent}>
      {block.lists.length > 0 && (
        <span aria-hidden="true" className="text-muted">
          {listPrefix(block)}
        </span>
      )}
      {children}
    </p>
  );
}

/**
 * The compared text: blocks that did not change once, full width; a changed block as its two versions side by side
 * (stacked on a phone), each labelled.
 */
export default function DocChanges({
  blocks,
  beforeLabel,
  afterLabel,
}: {
  blocks: BlockChange[];
  beforeLabel: string;
  afterLabel: string;
}) {
  return (
    <div className="grid min-w-0 gap-x-6 gap-y-2 lg:grid-cols-2">
      {blocks.map((b, i) => {
        if (b.op === 'same')
          return (
            <div key={i} className="min-w-0 lg:col-span-2">
              <BlockText block={b.block}>
                <Pieces pieces={b.pieces} side="after" />
              </BlockText>
            </div>
          );
        return (
          <div
            key={i}
            className="grid min-w-0 gap-x-6 gap-y-1 rounded-md border border-line bg-surface p-2 lg:col-span-2 lg:grid-cols-2"
            data-change={b.op}
          >
            <div className="min-w-0">
              <p className="eyebrow">{beforeLabel}</p>
              {b.op === 'added' ? (
                <p className="text-sm text-muted">Not there yet.</p>
              ) : (
                <BlockText block={b.block}>
                  <Pieces pieces={b.pieces} side="before" />
                </BlockText>
              )}
            </div>
            <div className="min-w-0">
              <p className="eyebrow">{afterLabel}</p>
              {b.op === 'removed' ? (
                <p className="text-sm text-muted">Removed.</p>
              ) : (
                <BlockText block={b.block}>
                  <Pieces pieces={b.pieces} side="after" />
                </BlockText>
              )}
              {b.shapeChange && (
                <p className="mt-1 text-xs text-muted">
                  Was {b.shapeChange.before}; now {b.shapeChange.after}.
                </p>
              )}
            </div>
          </div>
        );
      })}
    </div>
  );
}
