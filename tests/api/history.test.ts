// The history page's view model and the dates it shows: every version with who, when, change note and status,
// status changes as changes, and the demo's records dated by their versions.
import { describe, it, expect, beforeAll } from 'vitest';
import { eq } from 'drizzle-orm';
import { call } from '../setup/http';
import { seedDemo, sessionsForAllRoles, type DemoRole } from '../setup/db';
import * as recordsRoute from '../../src/pages/api/records/index';
import * as recordRoute from '../../src/pages/api/records/[id]/index';
import * as statusRoute from '../../src/pages/api/records/[id]/status';
import { db } from '../../src/lib/server/db/client';
import { recordRevisions, records } from '../../src/lib/server/db/schema';
import { recordHistory } from '../../src/lib/server/records/history';

let s: Record<DemoRole, string>;
const doc = (...texts: string[]) => ({
  type: 'doc',
  content: texts.map((text) => ({ type: 'paragraph', content: [{ type: 'text', text }] })),
});

beforeAll(async () => {
  await seedDemo();
  s = await sessionsForAllRoles();
});

describe('demo dates', () => {
  it('every demo record is dated by its current version, not by its newest comment', () => {
    const rows = db().select().from(records).all();
    expect(rows.length).toBeGreaterThan(20);
    for (const r of rows) {
      const rev = db()
        .select()
        .from(recordRevisions)
        .where(eq(recordRevisions.recordId, r.id))
        .all()
        .find((x) => x.version === r.version)!;
      expect(r.updatedAt.toISOString(), r.id).toBe(rev.createdAt.toISOString());
    }
    // The record where the facts panel once said 2026-03-21 (a comment's day) and the history 2025-11-14: its
    // current version is now dated by the day it was saved, and its first by the day it was written.
    const two = rows.find((r) => r.id === 'demo-rec-2526-two-propellers')!;
    expect(two.version).toBe(4);
    expect(two.updatedAt.toISOString().slice(0, 10)).toBe('2026-03-22');
    expect(two.createdAt.toISOString().slice(0, 10)).toBe('2025-11-14');
  });

  it('the demo has a record with several versions: edits with notes, a mark change and an acceptance', () => {
    const h = recordHistory('demo-rec-2526-two-propellers')!;
    expect(h.versions.map((v) => [v.version, v.status, v.editor])).toEqual([
      [1, 'proposed', 'Jonas Lindqvist'],
      [2, 'proposed', 'Jonas Lindqvist'],
      [3, 'accepted', 'Dr. Felix Arnaud'],
      [4, 'accepted', 'Jonas Lindqvist'],
    ]);
    expect(h.versions[1].changeNote).toContain('recomputed endurance calculation');
    expect(h.versions[1].words).toMatchObject({ marks: 1 });
    expect(h.versions[2]).toMatchObject({ statusChange: { from: 'proposed', to: 'accepted' }, changeNote: null });
    expect(h.versions[3].words?.inserted).toBeGreaterThan(20);
    // Reviewed on the day of version 3, so the facts panel can say it changed since.
    const two = db().select().from(records).where(eq(records.id, 'demo-rec-2526-two-propellers')).get()!;
    expect(two.reviewedVersion).toBe(3);
  });
});

describe('recordHistory', () => {
  it('lists every version oldest first with editor, note, status and what changed; opens the newest by default', async () => {
    const created = await call(recordsRoute, 'POST', {
      session: s.member,
      body: { kind: 'decision', title: 'Fuse the lead at 80 A', subsystem: 'battery', body: doc('An 80 A fuse.') },
    });
    const id = created.body.record.id;
    const edited = await call(recordRoute, 'PATCH', {
      session: s.member,
      params: { id },
      body: { version: 1, body: doc('A 100 A fuse at the pack end.'), changeNote: 'Rated for the sprint current' },
    });
    expect(edited.status).toBe(200);
    expect(
      (await call(statusRoute, 'POST', { session: s.member, params: { id }, body: { status: 'proposed' } })).status,
    ).toBe(200);

    const h = recordHistory(id)!;
    expect(h.versions.map((v) => [v.version, v.status, v.editor])).toEqual([
      [1, 'draft', 'Jonas Lindqvist'],
      [2, 'draft', 'Jonas Lindqvist'],
      [3, 'proposed', 'Jonas Lindqvist'],
    ]);
    expect(h.versions[0].words).toBeNull();
    expect(h.versions[1]).toMatchObject({ changeNote: 'Rated for the sprint current', statusChange: null });
    // “An 80 A fuse.” → “A 100 A fuse at the pack end.”: one paragraph edited, not one removed and one added.
    expect(h.versions[1].words).toMatchObject({ inserted: 6, deleted: 2 });
    // The note the app writes for a status change is not repeated as a change note; the change itself is shown.
    expect(h.versions[2]).toMatchObject({ changeNote: null, statusChange: { from: 'draft', to: 'proposed' } });
    expect(h.selected.version.version).toBe(3);
    expect(h.selected.previous?.version).toBe(2);

    const v2 = recordHistory(id, 2)!.selected;
    expect(v2.diff.blocks[0].op).toBe('changed');
    expect(
      v2.diff.blocks[0].pieces
        .filter((p) => p.op === 'ins')
        .map((p) => p.text)
        .join(''),
    ).toContain('A 100');
    // An unknown version opens the newest rather than failing.
    expect(recordHistory(id, 99)!.selected.version.version).toBe(3);
  });

  it('a single version is compared with nothing: its text once, no changes', () => {
    const h = recordHistory('demo-rec-2425-cell-drift')!;
    expect(h.versions).toHaveLength(1);
    expect(h.selected.previous).toBeNull();
    expect(h.selected.diff.blocks.every((b) => b.op === 'same')).toBe(true);
    expect(h.selected.diff.stats.changedBlocks).toBe(0);
  });

  it('knows no history for a record that does not exist', () => {
    expect(recordHistory('nope')).toBeNull();
  });
});
