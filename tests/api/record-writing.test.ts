// Writing records (issue 13, section 1): what the template stores, change notes, and discarding drafts.
import { describe, it, expect, beforeAll } from 'vitest';
import { eq } from 'drizzle-orm';
import { call } from '../setup/http';
import { seedDemo, sessionsForAllRoles, type DemoRole } from '../setup/db';
import { unzip } from '../setup/zip';
import * as recordsRoute from '../../src/pages/api/records/index';
import * as recordRoute from '../../src/pages/api/records/[id]/index';
import * as revisions from '../../src/pages/api/records/[id]/revisions';
import * as status from '../../src/pages/api/records/[id]/status';
import * as commentsRoute from '../../src/pages/api/records/[id]/comments';
import * as searchRoute from '../../src/pages/api/search';
import * as onboardingRoute from '../../src/pages/api/onboarding/[subsystem]/index';
import * as readinessRoute from '../../src/pages/api/readiness';
import * as exportRoute from '../../src/pages/api/export';
import * as audit from '../../src/pages/api/audit';
import { db } from '../../src/lib/server/db/client';
import { records } from '../../src/lib/server/db/schema';
import { subsystemTimeline } from '../../src/lib/server/records/timeline';
import { SECTION_PROMPTS, templateFor } from '../../src/lib/editor/templates';

let s: Record<DemoRole, string>;
beforeAll(async () => {
  await seedDemo();
  s = await sessionsForAllRoles();
});

async function create(role: DemoRole, extra: object = {}) {
  const res = await call(recordsRoute, 'POST', {
    session: s[role],
    body: {
      kind: 'decision',
      title: 'Fuse the main cable at 125 A',
      subsystem: 'battery',
      body: templateFor('decision'),
      ...extra,
    },
  });
  expect(res.status, res.text).toBe(201);
  return res.body.record as { id: string; version: number; title: string };
}

const storedBody = (id: string) => JSON.stringify(db().select().from(records).where(eq(records.id, id)).get()!.body);

describe('the template', () => {
  it('a record saved straight from the template stores neither prompt text nor an italic mark', async () => {
    for (const kind of ['decision', 'lesson'] as const) {
      const r = await create('member', {
        kind,
        body: templateFor(kind),
        ...(kind === 'lesson' ? { source: 'testing' } : {}),
      });
      const stored = storedBody(r.id);
      expect(stored).not.toContain('italic');
      for (const prompt of SECTION_PROMPTS) expect(stored).not.toContain(prompt);
      const rev = (await call(revisions, 'GET', { session: s.member, params: { id: r.id } })).body.revisions[0];
      for (const prompt of SECTION_PROMPTS) expect(rev.bodyText).not.toContain(prompt);
    }
  });

  it('text typed into a section is stored as typed, with no mark it did not ask for', async () => {
    const body = templateFor('decision');
    body.content![1] = { type: 'paragraph', content: [{ type: 'text', text: 'The 6 mm² cable ran at 71 °C.' }] };
    const r = await create('member', { body });
    const context = JSON.parse(storedBody(r.id)).content[1];
    expect(context).toEqual({ type: 'paragraph', content: [{ type: 'text', text: 'The 6 mm² cable ran at 71 °C.' }] });
  });

  it('prompt text sent by an older editor is dropped; an empty trailing list item is not saved', async () => {
    const r = await create('member', {
      body: {
        type: 'doc',
        content: [
          { type: 'heading', attrs: { level: 2 }, content: [{ type: 'text', text: 'Context' }] },
          {
            type: 'paragraph',
            content: [{ type: 'text', marks: [{ type: 'italic' }], text: SECTION_PROMPTS[0] }],
          },
          {
            type: 'bulletList',
            content: [
              { type: 'listItem', content: [{ type: 'paragraph', content: [{ type: 'text', text: 'Fuse first' }] }] },
              { type: 'listItem', content: [{ type: 'paragraph' }] },
            ],
          },
        ],
      },
    });
    const full = (await call(recordRoute, 'GET', { session: s.member, params: { id: r.id } })).body.record;
    expect(full.bodyHtml).toBe('<h2>Context</h2><ul><li><p>Fuse first</p></li></ul>');
    expect(storedBody(r.id)).not.toContain(SECTION_PROMPTS[0]);
  });
});

describe('change notes', () => {
  it('PATCH keeps changeNote with the new version; revisions list it with the status at each version', async () => {
    const r = await create('member');
    const saved = await call(recordRoute, 'PATCH', {
      session: s.member,
      params: { id: r.id },
      body: { version: 1, title: 'Fuse the main cable at 150 A', changeNote: '  Bollard pull peaked at 131 A.  ' },
    });
    expect(saved.status, saved.text).toBe(200);
    await call(status, 'POST', { session: s.member, params: { id: r.id }, body: { status: 'proposed' } });
    const plain = await call(recordRoute, 'PATCH', {
      session: s.member,
      params: { id: r.id },
      body: { version: 3, title: 'Fuse the main cable at 160 A' },
    });
    expect(plain.status).toBe(200);
    const revs = (await call(revisions, 'GET', { session: s.alumni, params: { id: r.id } })).body.revisions;
    expect(revs.map((v: { version: number; status: string }) => [v.version, v.status])).toEqual([
      [4, 'proposed'],
      [3, 'proposed'],
      [2, 'draft'],
      [1, 'draft'],
    ]);
    expect(revs[2].changeNote).toBe('Bollard pull peaked at 131 A.');
    expect(revs[0].changeNote).toBeNull();
  });

  it('refuses a note over 280 characters or with control characters (400 on changeNote); a blank one is none', async () => {
    const r = await create('member');
    for (const changeNote of ['x'.repeat(281), 'bad\u0000note']) {
      const res = await call(recordRoute, 'PATCH', {
        session: s.member,
        params: { id: r.id },
        body: { version: 1, changeNote },
      });
      expect(res.status).toBe(400);
      expect(res.body.error.issues[0].path).toBe('changeNote');
    }
    const ok = await call(recordRoute, 'PATCH', {
      session: s.member,
      params: { id: r.id },
      body: { version: 1, changeNote: 'y'.repeat(280) },
    });
    expect(ok.status).toBe(200);
    const blank = await call(recordRoute, 'PATCH', {
      session: s.member,
      params: { id: r.id },
      body: { version: 2, changeNote: '   ' },
    });
    expect(blank.status).toBe(200);
    const revs = (await call(revisions, 'GET', { session: s.member, params: { id: r.id } })).body.revisions;
    expect(revs[0].changeNote).toBeNull();
    expect(revs[1].changeNote).toHaveLength(280);
  });
});

describe('discarding a draft', () => {
  it('its author → 204; a lead may discard anyone’s draft; others 403; past draft 409; unknown 404', async () => {
    const mine = await create('member');
    for (const role of ['advisor', 'alumni'] as const)
      expect((await call(recordRoute, 'DELETE', { session: s[role], params: { id: mine.id } })).status).toBe(403);
    expect((await call(recordRoute, 'DELETE', { params: { id: mine.id } })).status).toBe(401);
    expect((await call(recordRoute, 'DELETE', { session: s.member, params: { id: mine.id } })).status).toBe(204);
    expect((await call(recordRoute, 'DELETE', { session: s.member, params: { id: mine.id } })).status).toBe(404);

    const leads = await create('lead');
    // A member may not discard someone else's draft, even in the current season.
    const other = await call(recordRoute, 'DELETE', { session: s.member, params: { id: leads.id } });
    expect(other.status).toBe(403);
    expect(other.body.error.code).toBe('forbidden');
    const byMember = await create('member');
    expect((await call(recordRoute, 'DELETE', { session: s.lead, params: { id: byMember.id } })).status).toBe(204);

    const proposed = await create('member');
    await call(status, 'POST', { session: s.member, params: { id: proposed.id }, body: { status: 'proposed' } });
    const late = await call(recordRoute, 'DELETE', { session: s.member, params: { id: proposed.id } });
    expect(late.status).toBe(409);
    expect(late.body.error.message).toMatch(/Only drafts can be discarded/);
    expect((await call(recordRoute, 'DELETE', { session: s.lead, params: { id: proposed.id } })).status).toBe(409);
    // Lessons are never drafts.
    const lesson = await create('member', { kind: 'lesson', source: 'testing', body: templateFor('lesson') });
    expect((await call(recordRoute, 'DELETE', { session: s.member, params: { id: lesson.id } })).status).toBe(409);
    expect((await call(recordRoute, 'DELETE', { session: s.lead, params: { id: 'no-such-record' } })).status).toBe(404);

    const entries = (await call(audit, 'GET', { session: s.lead, query: { limit: '200', action: 'record.discard' } }))
      .body.entries;
    expect(entries.map((e: { target: string }) => e.target)).toEqual(
      expect.arrayContaining([`record:${mine.id}`, `record:${byMember.id}`]),
    );
  });

  it('a discarded draft is gone from lists, search, timelines, hubs, readiness, onboarding routes and the bundle', async () => {
    const word = 'quokkafender';
    const draft = await create('member', {
      title: `Mount the ${word} on the transom`,
      relatedRecordIds: ['demo-rec-2526-main-cable-size'],
    });
    const other = await create('member', { title: 'Battery box lid', relatedRecordIds: [draft.id] });
    const put = await call(onboardingRoute, 'PUT', {
      session: s.advisor,
      params: { subsystem: 'battery' },
      body: {
        items: [
          ...(
            await call(onboardingRoute, 'GET', { session: s.advisor, params: { subsystem: 'battery' } })
          ).body.items.map((i: { kind: string; ref: string }) => ({ kind: i.kind, ref: i.ref })),
          { kind: 'record', ref: draft.id },
        ],
      },
    });
    expect(put.status, put.text).toBe(200);

    const paths = async () => {
      const list = await call(recordsRoute, 'GET', {
        session: s.alumni,
        query: { limit: '100', subsystem: 'battery' },
      });
      const search = await call(searchRoute, 'GET', { session: s.alumni, query: { q: word } });
      const route = await call(onboardingRoute, 'GET', { session: s.member, params: { subsystem: 'battery' } });
      const readiness = await call(readinessRoute, 'GET', { session: s.member });
      const related = await call(recordRoute, 'GET', { session: s.member, params: { id: other.id } });
      const bundle = await unzip((await call(exportRoute, 'GET', { session: s.lead })).bytes);
      const bundleText = [...bundle.entries()].map(([name, bytes]) => name + '\n' + bytes.toString('utf8')).join('\n');
      return {
        list: JSON.stringify(list.body.records),
        search: JSON.stringify(search.body.hits),
        timeline: JSON.stringify(subsystemTimeline('battery', 'decision')),
        route: JSON.stringify(route.body.items),
        readiness: JSON.stringify(readiness.body),
        related: JSON.stringify(related.body.record.related),
        bundle: bundleText,
      };
    };
    const before = await paths();
    for (const [where, text] of Object.entries(before)) {
      if (where === 'readiness') continue; // readiness names no drafts; its route counts are checked below
      expect(text, where).toContain(word);
    }
    const readinessWithDraftOnRoute = before.readiness;

    expect((await call(recordRoute, 'DELETE', { session: s.member, params: { id: draft.id } })).status).toBe(204);
    const after = await paths();
    for (const [where, text] of Object.entries(after)) {
      expect(text, where).not.toContain(word);
      expect(text, where).not.toContain(draft.id);
    }
    // The route step went with the draft, rather than staying as a "no longer exists" step that readiness counts.
    expect(after.route).not.toContain('No longer exists');
    expect(JSON.parse(after.route)).toHaveLength(JSON.parse(before.route).length - 1);
    expect(after.readiness).not.toBe(readinessWithDraftOnRoute);

    for (const route of [recordRoute, revisions, commentsRoute])
      expect((await call(route, 'GET', { session: s.member, params: { id: draft.id } })).status).toBe(404);
    expect(
      (await call(recordRoute, 'PATCH', { session: s.member, params: { id: draft.id }, body: { version: 1 } })).status,
    ).toBe(404);
  });
});
