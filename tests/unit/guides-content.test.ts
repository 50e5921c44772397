import { describe, it, expect } from 'vitest';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { parse } from 'yaml';
import { guideSchema, guideIdFromPath } from '../../src/lib/guide-schema';

const base = 'src/content/guides';
const files = readdirSync(base, { recursive: true })
  .map(String)
  .filter((f) => f.endsWith('.mdx'));
const read = (f: string) => {
  const text = readFileSync(join(base, f), 'utf8');
  return { text, front: parse(/^---\n([\s\S]*?)\n---/.exec(text)![1]) };
};
const demoCalcIds = new Set(
  (JSON.parse(readFileSync('content/demo/calculations.json', 'utf8')) as { id: string }[]).map((c) => c.id),
);

describe('the guides collection', () => {
  it('has at least 10 guides over at least 6 subsystems, with unique slugs', () => {
    expect(files.length).toBeGreaterThanOrEqual(10);
    const subsystems = new Set(files.map((f) => read(f).front.subsystem));
    expect([...subsystems].filter((s) => s !== 'general').length).toBeGreaterThanOrEqual(6);
    const slugs = files.map(guideIdFromPath);
    expect(new Set(slugs).size).toBe(slugs.length);
  });

  it.each(files)('%s: front matter passes the schema; folder matches subsystem; linked calculations exist', (f) => {
    const { front } = read(f);
    const parsed = guideSchema.parse(front);
    expect(f.split('/')[0]).toBe(parsed.subsystem);
    for (const id of parsed.calculations) expect(demoCalcIds.has(id)).toBe(true);
  });

  it('at least two guides embed a live calculator', () => {
    expect(files.filter((f) => /<LiveCalculator\s+kind="[a-z-]+"/.test(read(f).text)).length).toBeGreaterThanOrEqual(2);
  });

  it('guides that touch batteries, propellers, high current or coolant carry a safety block', () => {
    const hazardous = files.filter((f) =>
      ['battery', 'propulsion', 'cooling', 'solar', 'steering'].includes(read(f).front.subsystem),
    );
    for (const f of hazardous) expect(read(f).text, f).toMatch(/> \*\*Safety\.\*\*/);
  });
});

describe('guideSchema refuses wrong front matter with the field named', () => {
  const good = {
    title: 'A guide',
    subsystem: 'hull',
    summary: 'A summary long enough.',
    order: 1,
    audience: 'everyone',
    reviewedBy: 'Ruth Calloway',
    reviewedOn: '2026-01-01',
  };
  it.each([
    ['title', { title: '' }],
    ['subsystem', { subsystem: 'rigging' }],
    ['reviewedOn', { reviewedOn: 'last spring' }],
    ['audience', { audience: 'everybody' }],
    ['calculations', { calculations: ['Not A Slug'] }],
  ])('%s', (field, patch) => {
    const r = guideSchema.safeParse({ ...good, ...patch });
    expect(r.success).toBe(false);
    expect(r.error!.issues[0].path[0]).toBe(field);
  });
  it('refuses unknown keys (typos)', () => {
    expect(guideSchema.safeParse({ ...good, reviwedBy: 'x' }).success).toBe(false);
  });
  it('accepts a correct one and fills defaults', () => {
    expect(guideSchema.parse(good)).toMatchObject({ calculations: [], tags: [], records: [] });
  });
});
