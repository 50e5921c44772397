// The review list of an import and its bulk changes: kind, subsystem and season of many drafts at once, and discard.
import { describe, it, expect, beforeAll } from 'vitest';
import { eq } from 'drizzle-orm';
import { call } from '../setup/http';
import { seedDemo, sessionsForAllRoles, type DemoRole } from '../setup/db';
import * as recordsRoute from '../../src/pages/api/records/index';
import * as recordRoute from '../../src/pages/api/records/[id]/index';
import * as revisions from '../../src/pages/api/records/[id]/revisions';
import * as reviewRoute from '../../src/pages/api/imports/[id]/records';
import * as discardRoute from '../../src/pages/api/imports/[id]/discard';
import * as audit from '../../src/pages/api/audit';
import * as importsRoute from '../../src/pages/api/imports/index';
import { importsSettled } from '../../src/lib/server/imports/queue';
import { db } from '../../src/lib/server/db/client';
import { importItems, imports, users } from '../../src/lib/server/db/schema';
import { listSeasons } from '../../src/lib/server/seasons';
import { newId } from '../../src/lib/server/ids';
import { templateFor } from '../../src/lib/editor/templates';

let s: Record<DemoRole, string>;
let current = '';
let past = '';
beforeAll(async () => {
  await seedDemo();
  s = await sessionsForAllRoles();
  const seasons = listSeasons();
  current = seasons.find((x) => x.current)!.id;
  past = seasons.find((x) => !x.current)!.id;
});

function userId(role: DemoRole): string {
  return db()
    .select({ id: users.id })
    .from(users)
    .where(eq(users.email, `${role}@wakebook.test`))
    .get()!.id;
}

/**
 * An import as the queue leaves it: drafts written through the records API, and the import's rows pointing at them
 * (plus a skipped file pointing at an older record and a failed one).
 */
async function makeImport(role: DemoRole, kinds: ('decision' | 'lesson')[]) {
  const ids: string[] = [];
  for (const [i, kind] of kinds.entries()) {
    const res = await call(recordsRoute, 'POST', {
      session: s[role],
      body: { kind, title: `Imported note ${i + 1} of ${role}`, subsystem: 'battery', body: templateFor(kind) },
    });
    expect(res.status).toBe(201);
    ids.push(res.body.record.id);
  }
  const id = newId();
  const now = new Date();
  db()
    .insert(imports)
    .values({
      id,
      userId: userId(role),
      subsystemSlug: 'battery',
      kind: kinds[0],
      state: 'done',
      total: ids.length + 2,
      done: ids.length + 2,
      createdAt: now,
      finishedAt: now,
    })
    .run();
  const item = (position: number, extra: Partial<typeof importItems.$inferInsert>) =>
    db()
      .insert(importItems)
      .values({
        id: newId(),
        importId: id,
        position,
        fileName: `file-${position}.md`,
        size: 100 + position,
        sha256: `sha-${id}-${position}`,
        state: 'done',
        createdAt: now,
        finishedAt: now,
        ...extra,
      })
      .run();
  ids.forEach((recordId, p) => item(p, { recordId }));
  item(ids.length, { state: 'skipped', recordId: 'demo-rec-2526-two-propellers', message: 'Already imported.' });
  item(ids.length + 1, { state: 'failed', fileName: 'broken.docx', message: 'broken.docx could not be read.' });
  return { id, recordIds: ids };
}

const review = (importId: string, session: string) => call(reviewRoute, 'GET', { session, params: { id: importId } });
const change = (importId: string, session: string, body: object) =>
  call(reviewRoute, 'PATCH', { session, params: { id: importId }, body });

/** Starts an import through the real API, as the page does, and waits for the queue to convert it. */
async function importThroughApi(role: DemoRole, files: Record<string, string>, fields: Record<string, string>) {
  const form = new FormData();
  for (const [name, text] of Object.entries(files)) form.append('file', new Blob([text]), name);
  for (const [k, v] of Object.entries(fields)) form.set(k, v);
  const request = new Request('http://localhost/', { method: 'POST', body: form });
  const res = await call(importsRoute, 'POST', {
    session: s[role],
    rawBody: new Uint8Array(await request.arrayBuffer()),
    headers: { 'content-type': request.headers.get('content-type')! },
  });
  expect(res.status, res.text).toBe(202);
  await importsSettled();
  return res.body.import.id as string;
}

describe('the review list', () => {
  it('follows an import made through the API: each file a draft with title, kind, season and preview', async () => {
    const stamp = Date.now();
    const id = await importThroughApi(
      'member',
      {
        'shaft-notes.md': `# Shaft line notes ${stamp}\n\nThe coupling slipped twice at full power.\n\nSecond line.`,
        'crew.txt': `Crew roster habits ${stamp}\nEveryone signs the logbook.`,
      },
      { subsystem: 'propulsion', kind: 'lesson' },
    );
    const res = await review(id, s.member);
    expect(res.status).toBe(200);
    expect(res.body.review).toMatchObject({ state: 'done', total: 2, done: 2 });
    const [md, txt] = res.body.review.rows;
    expect(md).toMatchObject({ fileName: 'shaft-notes.md', state: 'done' });
    expect(md.draft).toMatchObject({ kind: 'lesson', subsystem: 'propulsion', seasonId: current });
    expect(md.draft.title).toBe(`Shaft line notes ${stamp}`);
    expect(md.draft.preview).toContain('The coupling slipped twice at full power.');
    expect(txt.draft.subsystemName).toBe('Propulsion and motor drive');
    // The same bytes again: skipped, naming the draft that already holds them.
    const again = await importThroughApi(
      'member',
      { 'shaft-notes.md': `# Shaft line notes ${stamp}\n\nThe coupling slipped twice at full power.\n\nSecond line.` },
      { subsystem: 'propulsion', kind: 'lesson' },
    );
    const skipped = (await review(again, s.member)).body.review.rows[0];
    expect(skipped).toMatchObject({ state: 'skipped', draft: null });
    expect(skipped.existing).toEqual({ id: md.draft.id, title: md.draft.title });
    // Bulk change on the real import: both become decision drafts.
    const changed = await change(id, s.member, { recordIds: [md.draft.id, txt.draft.id], kind: 'decision' });
    expect(changed.body).toEqual({ updated: 2 });
    const r = (await call(recordRoute, 'GET', { session: s.member, params: { id: md.draft.id } })).body.record;
    expect(r).toMatchObject({ kind: 'decision', status: 'draft' });
  });

  it('shows each file with its draft, the record a skipped file is already in, and why one failed', async () => {
    const imp = await makeImport('member', ['decision', 'lesson']);
    const res = await review(imp.id, s.member);
    expect(res.status).toBe(200);
    const rows = res.body.review.rows;
    expect(rows).toHaveLength(4);
    expect(rows[0].draft).toMatchObject({ id: imp.recordIds[0], kind: 'decision', subsystem: 'battery' });
    expect(rows[0].draft.preview.length).toBeGreaterThan(0);
    expect(rows[0].size).toBe(100);
    expect(rows[2]).toMatchObject({ state: 'skipped', draft: null });
    expect(rows[2].existing.id).toBe('demo-rec-2526-two-propellers');
    expect(rows[2].existing.title.length).toBeGreaterThan(3);
    expect(rows[3]).toMatchObject({ state: 'failed', message: 'broken.docx could not be read.', draft: null });
  });

  it('is the importer’s and the leads’: another member, advisors and alumni get 403', async () => {
    const imp = await makeImport('lead', ['decision']);
    expect((await review(imp.id, s.lead)).status).toBe(200);
    expect((await review(imp.id, s.member)).status).toBe(403);
    expect((await review(imp.id, s.advisor)).status).toBe(403);
    expect((await review(imp.id, s.alumni)).status).toBe(403);
    expect((await call(reviewRoute, 'GET', { params: { id: imp.id } })).status).toBe(401);
    expect((await review('no-such-import', s.lead)).status).toBe(404);
  });
});

describe('changing many drafts at once', () => {
  it('changes the kind of two drafts, keeping each a draft of its new kind, as a new audited version', async () => {
    const imp = await makeImport('member', ['decision', 'decision', 'decision']);
    const res = await change(imp.id, s.member, { recordIds: imp.recordIds.slice(0, 2), kind: 'lesson' });
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ updated: 2 });
    for (const id of imp.recordIds.slice(0, 2)) {
      const r = (await call(recordRoute, 'GET', { session: s.member, params: { id } })).body.record;
      expect(r).toMatchObject({ kind: 'lesson', status: 'open', version: 2 });
      const revs = (await call(revisions, 'GET', { session: s.member, params: { id } })).body.revisions;
      expect(JSON.stringify(revs)).toContain('kind decision → lesson');
    }
    const third = (await call(recordRoute, 'GET', { session: s.member, params: { id: imp.recordIds[2] } })).body;
    expect(third.record).toMatchObject({ kind: 'decision', status: 'draft', version: 1 });
    // And back: a lesson becomes a decision draft again.
    const back = await change(imp.id, s.member, { recordIds: [imp.recordIds[0]], kind: 'decision' });
    expect(back.body).toEqual({ updated: 1 });
    const r = (await call(recordRoute, 'GET', { session: s.member, params: { id: imp.recordIds[0] } })).body.record;
    expect(r).toMatchObject({ kind: 'decision', status: 'draft', version: 3 });
    const log = await call(audit, 'GET', { session: s.lead, query: { limit: '50' } });
    const mine = log.body.entries.filter(
      (e: { action: string; target: string }) =>
        e.action === 'record.import-change' && e.target === `record:${imp.recordIds[1]}`,
    );
    expect(mine).toHaveLength(1);
  });

  it('changes subsystem and season; a member only into the current season, a lead into any', async () => {
    const imp = await makeImport('member', ['decision', 'lesson']);
    const moved = await change(imp.id, s.member, { recordIds: imp.recordIds, subsystem: 'hull', seasonId: current });
    expect(moved.body).toEqual({ updated: 2 });
    const r = (await call(recordRoute, 'GET', { session: s.member, params: { id: imp.recordIds[1] } })).body.record;
    expect(r).toMatchObject({ subsystem: 'hull', seasonId: current, kind: 'lesson', status: 'open' });
    // Nothing to change: counted as none, no new version.
    expect((await change(imp.id, s.member, { recordIds: imp.recordIds, subsystem: 'hull' })).body).toEqual({
      updated: 0,
    });
    const refused = await change(imp.id, s.member, { recordIds: imp.recordIds, seasonId: past });
    expect(refused.status).toBe(403);
    const still = (await call(recordRoute, 'GET', { session: s.member, params: { id: imp.recordIds[0] } })).body;
    expect(still.record.seasonId).toBe(current);
    const lead = await change(imp.id, s.lead, { recordIds: imp.recordIds, seasonId: past });
    expect(lead.body).toEqual({ updated: 2 });
  });

  it('refuses bad input field by field, and ids that are not drafts of this import', async () => {
    const imp = await makeImport('member', ['decision']);
    const other = await makeImport('member', ['decision']);
    const empty = await change(imp.id, s.member, { recordIds: [] });
    expect(empty.status).toBe(400);
    expect(empty.body.error.code).toBe('invalid_input');
    expect(empty.body.error.issues.map((i: { path: string }) => i.path)).toContain('recordIds');
    const nothing = await change(imp.id, s.member, { recordIds: imp.recordIds });
    expect(nothing.status).toBe(400);
    expect(nothing.body.error.issues[0].path).toBe('kind');
    const badKind = await change(imp.id, s.member, { recordIds: imp.recordIds, kind: 'memo' });
    expect(badKind.body.error.issues[0].path).toBe('kind');
    const badSub = await change(imp.id, s.member, { recordIds: imp.recordIds, subsystem: 'no-such' });
    expect(badSub.body.error.issues[0]).toEqual({ path: 'subsystem', message: 'No such subsystem.' });
    const badSeason = await change(imp.id, s.member, { recordIds: imp.recordIds, seasonId: 'nope' });
    expect(badSeason.body.error.issues[0].path).toBe('seasonId');
    const extra = await change(imp.id, s.member, { recordIds: imp.recordIds, kind: 'lesson', status: 'accepted' });
    expect(extra.status).toBe(400);
    // A draft of another import, and a demo record that is no draft at all: refused, and nothing changes.
    for (const foreign of [other.recordIds[0], 'demo-rec-2526-two-propellers']) {
      const res = await change(imp.id, s.member, { recordIds: [...imp.recordIds, foreign], kind: 'lesson' });
      expect(res.status).toBe(400);
      expect(res.body.error.issues[0].message).toContain(foreign);
    }
    const r = (await call(recordRoute, 'GET', { session: s.member, params: { id: imp.recordIds[0] } })).body.record;
    expect(r).toMatchObject({ kind: 'decision', version: 1 });
    // Someone else's import is refused to a member, whatever the ids.
    const leads = await makeImport('lead', ['decision']);
    expect((await change(leads.id, s.member, { recordIds: leads.recordIds, kind: 'lesson' })).status).toBe(403);
  });

  it('leaves a draft alone once it has moved on from draft', async () => {
    const imp = await makeImport('lead', ['decision']);
    const [id] = imp.recordIds;
    const moved = await call(await import('../../src/pages/api/records/[id]/status'), 'POST', {
      session: s.lead,
      params: { id },
      body: { status: 'proposed' },
    });
    expect(moved.status).toBe(200);
    expect((await change(imp.id, s.lead, { recordIds: [id], kind: 'lesson' })).status).toBe(400);
    const rows = (await review(imp.id, s.lead)).body.review.rows;
    expect(rows[0]).toMatchObject({ draft: null, gone: 'moved-on' });
  });
});

describe('discarding many drafts at once', () => {
  it('discards decisions and lessons of the import; they leave the lists; a second go is refused', async () => {
    const imp = await makeImport('member', ['decision', 'lesson', 'decision']);
    const gone = imp.recordIds.slice(0, 2);
    const res = await call(discardRoute, 'POST', {
      session: s.member,
      params: { id: imp.id },
      body: { recordIds: gone },
    });
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ discarded: 2 });
    for (const id of gone)
      expect((await call(recordRoute, 'GET', { session: s.member, params: { id } })).status).toBe(404);
    const rows = (await review(imp.id, s.member)).body.review.rows;
    expect(rows.map((r: { gone: string | null }) => r.gone).slice(0, 3)).toEqual(['discarded', 'discarded', null]);
    const again = await call(discardRoute, 'POST', {
      session: s.member,
      params: { id: imp.id },
      body: { recordIds: gone },
    });
    expect(again.status).toBe(400);
    const log = await call(audit, 'GET', { session: s.lead, query: { limit: '50' } });
    expect(
      log.body.entries.filter((e: { action: string; target: string }) =>
        gone.some((g) => e.action === 'record.discard' && e.target === `record:${g}`),
      ),
    ).toHaveLength(2);
  });

  it('refuses another member, advisors and alumni, and a skipped file’s older record', async () => {
    const imp = await makeImport('lead', ['decision']);
    const body = { recordIds: imp.recordIds };
    expect((await call(discardRoute, 'POST', { session: s.member, params: { id: imp.id }, body })).status).toBe(403);
    expect((await call(discardRoute, 'POST', { session: s.advisor, params: { id: imp.id }, body })).status).toBe(403);
    const older = await call(discardRoute, 'POST', {
      session: s.lead,
      params: { id: imp.id },
      body: { recordIds: ['demo-rec-2526-two-propellers'] },
    });
    expect(older.status).toBe(400);
    const r = await call(recordRoute, 'GET', { session: s.lead, params: { id: 'demo-rec-2526-two-propellers' } });
    expect(r.status).toBe(200);
  });
});
