import { describe, it, expect } from 'vitest';
import { blocksOf, diffDocs, diffRuns, diffTitles, type Piece } from '../../src/lib/record-diff';
import {
  differingFirst,
  mergeNodes,
  mergeSections,
  pairSections,
  splitSections,
  type DocNode,
} from '../../src/lib/record-sections';

type Mark = { type: string; attrs?: Record<string, unknown> };
const t = (text: string, marks?: Mark[]): DocNode => ({ type: 'text', text, ...(marks ? { marks } : {}) });
const p = (...content: (string | DocNode)[]): DocNode => ({
  type: 'paragraph',
  content: content.map((c) => (typeof c === 'string' ? t(c) : c)),
});
const h = (text: string): DocNode => ({ type: 'heading', attrs: { level: 2 }, content: [t(text)] });
const doc = (...content: DocNode[]) => ({ type: 'doc', content });
const ops = (pieces: Piece[]) => pieces.map((x) => `${x.op}:${x.text}`);

describe('blocksOf', () => {
  it('reads an image as a block of its description, so adding or describing one is a change', () => {
    const img = (alt?: string): DocNode => ({
      type: 'image',
      attrs: { src: '/api/attachments/abcdefgh23456789', alt },
    });
    expect(blocksOf(doc(p('A'), img('Seal'), img())).map((b) => b.runs.map((r) => r.text).join(''))).toEqual([
      'A',
      '[Image: Seal]',
      '[Image: no description]',
    ]);
    const d = diffDocs(doc(p('A')), doc(p('A'), img('Seal')));
    expect(d.blocks.map((b) => b.op)).toEqual(['same', 'added']);
  });

  it('flattens headings, paragraphs, nested lists, task items and quotes in reading order', () => {
    const blocks = blocksOf(
      doc(
        h('Context'),
        {
          type: 'bulletList',
          content: [
            {
              type: 'listItem',
              content: [p('one'), { type: 'orderedList', content: [{ type: 'listItem', content: [p('two')] }] }],
            },
          ],
        },
        { type: 'taskList', content: [{ type: 'taskItem', attrs: { checked: true }, content: [p('done')] }] },
        { type: 'blockquote', content: [p('quoted')] },
      ),
    );
    expect(blocks.map((b) => [b.kind, b.runs.map((r) => r.text).join('')])).toEqual([
      ['heading', 'Context'],
      ['paragraph', 'one'],
      ['paragraph', 'two'],
      ['paragraph', 'done'],
      ['paragraph', 'quoted'],
    ]);
    expect(blocks[2].lists.map((l) => l.type)).toEqual(['bullet', 'ordered']);
    expect(blocks[3].lists[0]).toEqual({ type: 'task', checked: true });
    expect(blocks[4].quote).toBe(true);
  });

  it('survives documents that are not documents', () => {
    expect(blocksOf(null)).toEqual([]);
    expect(blocksOf({ content: 'nope' })).toEqual([]);
    expect(blocksOf({ content: [null, 3, { type: 'paragraph', content: [null] }] })).toHaveLength(1);
  });
});

describe('diffRuns: word by word', () => {
  it('marks the inserted and deleted words inside the sentence', () => {
    const d = diffRuns(
      [{ text: 'The prop ventilated in turns.', marks: [] }],
      [{ text: 'The sprint prop ventilated at the start.', marks: [] }],
    );
    expect(ops(d.pieces)).toEqual([
      'same:The ',
      'ins:sprint ',
      'same:prop ventilated ',
      'del:in turns',
      'ins:at the start',
      'same:.',
    ]);
    expect(d.inserted).toBe(4);
    expect(d.deleted).toBe(2);
  });

  it('keeps numbers with units and decimals as one word', () => {
    const d = diffRuns(
      [{ text: 'Thrust 620 N at 1.6 m/s', marks: [] }],
      [{ text: 'Thrust 640 N at 1.6 m/s', marks: [] }],
    );
    expect(ops(d.pieces)).toEqual(['same:Thrust ', 'del:620', 'ins:640', 'same: N at 1.6 m/s']);
  });

  it('reports a change of marks on unchanged words as a change, in words', () => {
    const d = diffRuns(
      [{ text: 'use the castle nut', marks: [] }],
      [
        { text: 'use the ', marks: [] },
        { text: 'castle nut', marks: [{ type: 'bold' }] },
      ],
    );
    expect(d.marks).toBe(1);
    const changed = d.pieces.find((x) => x.markChange)!;
    expect(changed.text).toBe('castle nut');
    expect(changed.markChange).toEqual({ before: [], after: ['bold'] });
    expect(changed.oldMarks).toEqual([]);
    expect(d.inserted + d.deleted).toBe(0);
  });

  it('sees a link whose target changed', () => {
    const link = (href: string) => [{ type: 'link', attrs: { href } }];
    const d = diffRuns(
      [{ text: 'datasheet', marks: link('https://a.example/1') }],
      [{ text: 'datasheet', marks: link('https://a.example/2') }],
    );
    expect(d.pieces[0].markChange).toEqual({
      before: ['link to https://a.example/1'],
      after: ['link to https://a.example/2'],
    });
  });
});

describe('diffDocs', () => {
  it('finds nothing between a document and itself', () => {
    const a = doc(h('Context'), p('Same words.'));
    const d = diffDocs(a, structuredClone(a));
    expect(d.stats).toEqual({ insertedWords: 0, deletedWords: 0, markChanges: 0, changedBlocks: 0 });
    expect(d.blocks.every((b) => b.op === 'same')).toBe(true);
  });

  it('pairs an edited paragraph with its older self and keeps new and removed paragraphs whole', () => {
    const older = doc(h('Decision'), p('Run one propeller for every event.'), p('Order it in May.'));
    const newer = doc(h('Decision'), p('Run two propellers for every event.'), p('Swap them on the trolley.'));
    const d = diffDocs(older, newer);
    expect(d.blocks.map((b) => b.op)).toEqual(['same', 'changed', 'removed', 'added']);
    expect(ops(d.blocks[1].pieces)).toContain('ins:two propellers');
    expect(ops(d.blocks[1].pieces)).toContain('del:one propeller');
    expect(d.blocks[2].pieces.every((x) => x.op === 'del')).toBe(true);
    expect(d.blocks[3].pieces.every((x) => x.op === 'ins')).toBe(true);
  });

  it('counts a bold phrase as a mark change and a paragraph moved into a list as a change of shape', () => {
    const older = doc(p('Check the fuse.'), p('Tighten the lugs.'));
    const newer = doc(p('Check the ', t('fuse', [{ type: 'bold' }]), '.'), {
      type: 'bulletList',
      content: [{ type: 'listItem', content: [p('Tighten the lugs.')] }],
    });
    const d = diffDocs(older, newer);
    expect(d.stats.markChanges).toBe(1);
    expect(d.blocks[0].op).toBe('changed');
    expect(d.blocks[1]).toMatchObject({
      op: 'changed',
      shapeChange: { before: 'paragraph', after: 'paragraph, bullet list' },
    });
  });

  it('one short paragraph replaced by another in the same place is an edit of it', () => {
    const d = diffDocs(doc(p('An 80 A fuse.')), doc(p('A 100 A fuse at the pack end.')));
    expect(d.blocks.map((b) => b.op)).toEqual(['changed']);
    expect(ops(d.blocks[0].pieces)).toEqual([
      'del:An 80',
      'ins:A 100',
      'same: A fuse',
      'ins: at the pack end',
      'same:.',
    ]);
  });

  it('a title diff is word by word', () => {
    expect(ops(diffTitles('Run one propeller', 'Run two propellers'))).toEqual([
      'same:Run ',
      'del:one propeller',
      'ins:two propellers',
    ]);
  });
});

describe('record sections for the conflict view', () => {
  const base = doc(
    h('Context'),
    p('Hull refaired.'),
    h('Decision'),
    p('Two propellers.'),
    h('Consequences'),
    p('Swap.'),
  );

  it('cuts a document at its level-2 headings, keeping any opening text', () => {
    const s = splitSections(
      doc(p('Intro'), h('Context'), p('a'), { type: 'heading', attrs: { level: 3 }, content: [t('Sub')] }, p('b')),
    );
    expect(s.map((x) => [x.title, x.nodes.length])).toEqual([
      ['', 1],
      ['Context', 4],
    ]);
  });

  it('pairs sections by heading and puts the differing ones first', () => {
    const theirs = doc(
      h('Context'),
      p('Hull refaired.'),
      h('Decision'),
      p('Three propellers.'),
      h('Consequences'),
      p('Swap.'),
      h('Risks'),
      p('Lead time.'),
    );
    const pairs = pairSections(splitSections(base), splitSections(theirs));
    expect(pairs.map((x) => [x.title, x.same, !!x.mine, !!x.theirs])).toEqual([
      ['Context', true, true, true],
      ['Decision', false, true, true],
      ['Consequences', true, true, true],
      ['Risks', false, false, true],
    ]);
    expect(differingFirst(pairs).map((x) => x.title)).toEqual(['Decision', 'Risks', 'Context', 'Consequences']);
  });

  it('merges per section: mine, theirs, or both with nothing lost and shared blocks once', () => {
    const mine = doc(h('Decision'), p('Two propellers.'), p('Mine only.'));
    const theirs = doc(h('Decision'), p('Two propellers.'), p('Theirs only.'));
    const pairs = pairSections(splitSections(mine), splitSections(theirs));
    const text = (d: { content: DocNode[] }) => blocksOf(d).map((b) => b.runs.map((r) => r.text).join(''));
    expect(text(mergeSections(pairs, {}))).toEqual(['Decision', 'Two propellers.', 'Mine only.']);
    expect(text(mergeSections(pairs, { [pairs[0].key]: 'theirs' }))).toEqual([
      'Decision',
      'Two propellers.',
      'Theirs only.',
    ]);
    expect(text(mergeSections(pairs, { [pairs[0].key]: 'both' }))).toEqual([
      'Decision',
      'Two propellers.',
      'Mine only.',
      'Theirs only.',
    ]);
  });

  it('mergeNodes keeps each side’s order', () => {
    expect(mergeNodes([p('a'), p('b'), p('c')], [p('a'), p('x'), p('c')]).map((n) => n.content![0].text)).toEqual([
      'a',
      'b',
      'x',
      'c',
    ]);
  });

  it('an empty merge is still a valid document', () => {
    expect(mergeSections([], {})).toEqual({ type: 'doc', content: [{ type: 'paragraph' }] });
  });
});
