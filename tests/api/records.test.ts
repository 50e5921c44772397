import { describe, it, expect, beforeAll } from 'vitest';
import { readFileSync } from 'node:fs';
import { call } from '../setup/http';
import { seedDemo, sessionsForAllRoles, type DemoRole } from '../setup/db';
import * as recordsRoute from '../../src/pages/api/records/index';
import * as recordRoute from '../../src/pages/api/records/[id]/index';
import * as revisions from '../../src/pages/api/records/[id]/revisions';
import * as status from '../../src/pages/api/records/[id]/status';
import * as review from '../../src/pages/api/records/[id]/review';
import * as commentsRoute from '../../src/pages/api/records/[id]/comments';
import * as upload from '../../src/pages/api/records/[id]/attachments';
import * as download from '../../src/pages/api/attachments/[id]';
import * as seasonsRoute from '../../src/pages/api/seasons/index';
import * as audit from '../../src/pages/api/audit';
import { templateFor } from '../../src/lib/editor/templates';

let s: Record<DemoRole, string>;
let pastSeasonId = '';
beforeAll(async () => {
  await seedDemo();
  s = await sessionsForAllRoles();
  const seasons = (await call(seasonsRoute, 'GET', { session: s.lead })).body.seasons;
  pastSeasonId = seasons.find((x: { current: boolean }) => !x.current).id;
});

const doc = (text: string) => ({ type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text }] }] });
const newDecision = (extra: object = {}) => ({
  kind: 'decision',
  title: 'Use a 6 mm² main cable',
  subsystem: 'battery',
  body: templateFor('decision'),
  ...extra,
});

async function create(role: DemoRole = 'member', extra: object = {}) {
  const res = await call(recordsRoute, 'POST', { session: s[role], body: newDecision(extra) });
  expect(res.status).toBe(201);
  return res.body.record;
}

describe('listing', () => {
  it('401 signed out; lists the demo records newest first with filters and a cursor', async () => {
    expect((await call(recordsRoute, 'GET')).status).toBe(401);
    const all = await call(recordsRoute, 'GET', { session: s.alumni, query: { limit: '100' } });
    expect(all.status).toBe(200);
    expect(all.body.records.length).toBeGreaterThanOrEqual(25);
    const lessons = await call(recordsRoute, 'GET', { session: s.alumni, query: { kind: 'lesson', limit: '100' } });
    expect(lessons.body.records.every((r: { kind: string }) => r.kind === 'lesson')).toBe(true);
    const page = await call(recordsRoute, 'GET', { session: s.alumni, query: { limit: '10' } });
    const next = await call(recordsRoute, 'GET', {
      session: s.alumni,
      query: { limit: '10', cursor: page.body.nextCursor },
    });
    expect(next.body.records[0].id).not.toBe(page.body.records[0].id);
    // Pages follow on without overlap.
    const ids = new Set(page.body.records.map((r: { id: string }) => r.id));
    expect(next.body.records.some((r: { id: string }) => ids.has(r.id))).toBe(false);
    expect((await call(recordsRoute, 'GET', { session: s.alumni, query: { kind: 'memo' } })).status).toBe(400);
    const bad = await call(recordsRoute, 'GET', { session: s.alumni, query: { cursor: 'not-a-cursor' } });
    expect(bad.status).toBe(400);
    expect(bad.body.error.issues[0].path).toBe('cursor');
  });
});

describe('creating', () => {
  it('a member creates a decision in the current season; it starts as a draft with revision 1', async () => {
    const r = await create('member', {
      calculationIds: ['demo-calc-cable-battery-main-2526'],
      relatedRecordIds: ['demo-rec-2526-main-cable-size'],
    });
    expect(r).toMatchObject({ kind: 'decision', status: 'draft', version: 1, season: '2025–26', subsystem: 'battery' });
    expect(r.bodyHtml).toContain('<h2>Context</h2>');
    expect(r.calculations.map((c: { id: string }) => c.id)).toEqual(['demo-calc-cable-battery-main-2526']);
    expect(r.related.map((c: { id: string }) => c.id)).toEqual(['demo-rec-2526-main-cable-size']);
    const revs = await call(revisions, 'GET', { session: s.member, params: { id: r.id } });
    expect(revs.body.revisions.map((v: { version: number }) => v.version)).toEqual([1]);
  });

  it('renders HTML from the validated document only: scripts stay text, unsafe links and unknown attributes go', async () => {
    const body = {
      type: 'doc',
      content: [
        {
          type: 'paragraph',
          attrs: { onclick: 'alert(1)', style: 'x' },
          content: [{ type: 'text', text: '<script>alert("x")</script>' }],
        },
        {
          type: 'paragraph',
          content: [
            { type: 'text', text: 'bad link', marks: [{ type: 'link', attrs: { href: 'javascript:alert(1)' } }] },
          ],
        },
        {
          type: 'paragraph',
          content: [
            {
              type: 'text',
              text: 'good link',
              marks: [{ type: 'link', attrs: { href: 'https://ittc.info/', onmouseover: 'x' } }],
            },
          ],
        },
      ],
    };
    const r = await create('member', { body });
    expect(r.bodyHtml).not.toContain('<script');
    expect(r.bodyHtml).toContain('&lt;script&gt;');
    expect(r.bodyHtml).not.toMatch(/javascript:/i);
    expect(r.bodyHtml).not.toMatch(/onclick|onmouseover/i);
    expect(r.bodyHtml).toContain('href="https://ittc.info/"');
  });

  it('keeps only href on links: stored JSON has no class, target, rel or style; the server sets rel itself', async () => {
    const overlay = { class: 'fixed inset-0 z-50', target: '_blank', rel: 'opener', style: 'opacity:0', title: 't' };
    const body = {
      type: 'doc',
      content: [
        {
          type: 'paragraph',
          content: [
            {
              type: 'text',
              text: 'click',
              marks: [{ type: 'link', attrs: { href: 'https://ittc.info/', ...overlay } }],
            },
          ],
        },
      ],
    };
    const r = await create('member', { body });
    const stored = await call(recordRoute, 'GET', { session: s.member, params: { id: r.id } });
    const link = stored.body.record.body.content[0].content[0].marks[0];
    expect(link).toEqual({ type: 'link', attrs: { href: 'https://ittc.info/' } });
    expect(r.bodyHtml).toBe('<p><a rel="noopener noreferrer nofollow" href="https://ittc.info/">click</a></p>');
  });

  it.each([
    [
      'a code-block language that is not a short token',
      { type: 'codeBlock', attrs: { language: 'x" onmouseover=alert(1)' } },
    ],
    [
      'a negative list start',
      { type: 'orderedList', attrs: { start: -5 }, content: [{ type: 'listItem', content: [{ type: 'paragraph' }] }] },
    ],
    [
      'a list start given as text',
      {
        type: 'orderedList',
        attrs: { start: '1e9' },
        content: [{ type: 'listItem', content: [{ type: 'paragraph' }] }],
      },
    ],
    [
      'a task state that is not a boolean',
      {
        type: 'taskList',
        content: [{ type: 'taskItem', attrs: { checked: 'yes' }, content: [{ type: 'paragraph' }] }],
      },
    ],
  ])('refuses %s with 400 on body', async (_name, node) => {
    const res = await call(recordsRoute, 'POST', {
      session: s.member,
      body: newDecision({ body: { type: 'doc', content: [node] } }),
    });
    expect(res.status).toBe(400);
    expect(res.body.error.issues[0].path).toBe('body');
  });

  it('400 for a body that is not an editor document, a missing title, or links to nothing', async () => {
    const bad = await call(recordsRoute, 'POST', {
      session: s.member,
      body: newDecision({ body: { type: 'doc', content: [{ type: 'iframe' }] } }),
    });
    expect(bad.status).toBe(400);
    expect(bad.body.error.issues[0].path).toBe('body');
    const deep: Record<string, unknown> = { type: 'doc', content: [] };
    let cur = deep;
    for (let i = 0; i < 200; i++) {
      const next = { type: 'blockquote', content: [] as unknown[] };
      (cur.content as unknown[]).push(next);
      cur = next;
    }
    expect((await call(recordsRoute, 'POST', { session: s.member, body: newDecision({ body: deep }) })).status).toBe(
      400,
    );
    const noTitle = await call(recordsRoute, 'POST', { session: s.member, body: newDecision({ title: '' }) });
    expect(noTitle.status).toBe(400);
    expect(noTitle.body.error.issues[0].path).toBe('title');
    const ghost = await call(recordsRoute, 'POST', {
      session: s.member,
      body: newDecision({ calculationIds: ['nope'] }),
    });
    expect(ghost.status).toBe(400);
    expect(ghost.body.error.issues[0].path).toBe('calculationIds');
  });

  it.each([
    ['the editor document', (deep: string) => `{"type":"doc","content":[${deep}]}`],
    ['a node attribute', (deep: string) => `{"type":"doc","content":[{"type":"paragraph"}],"attrs":${deep}}`],
  ])('400 invalid_input, not 500, for %s nested 3,000 levels deep', async (_where, bodyJson) => {
    const deep = '{"type":"blockquote","content":['.repeat(3000) + ']}'.repeat(3000);
    const rawBody = `{"kind":"decision","title":"Deeply nested","subsystem":"battery","body":${bodyJson(deep)}}`;
    const res = await call(recordsRoute, 'POST', {
      session: s.member,
      rawBody,
      headers: { 'content-type': 'application/json' },
    });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input');
  });

  it('alumni and advisors may not write records (403); members may not write into a past season; leads may', async () => {
    for (const role of ['alumni', 'advisor'] as const) {
      expect((await call(recordsRoute, 'POST', { session: s[role], body: newDecision() })).status).toBe(403);
    }
    expect(
      (await call(recordsRoute, 'POST', { session: s.member, body: newDecision({ seasonId: pastSeasonId }) })).status,
    ).toBe(403);
    const lead = await call(recordsRoute, 'POST', { session: s.lead, body: newDecision({ seasonId: pastSeasonId }) });
    expect(lead.status).toBe(201);
  });
});

describe('editing without losing work', () => {
  it('PATCH with the current version saves and makes a revision; a stale version gets 409 with the current record', async () => {
    const r = await create();
    const ok = await call(recordRoute, 'PATCH', {
      session: s.member,
      params: { id: r.id },
      body: { version: 1, title: 'Use a 10 mm² main cable', body: doc('Heavier but cooler.') },
    });
    expect(ok.status).toBe(200);
    expect(ok.body.record.version).toBe(2);
    expect(ok.body.record.bodyHtml).toBe('<p>Heavier but cooler.</p>');
    const stale = await call(recordRoute, 'PATCH', {
      session: s.lead,
      params: { id: r.id },
      body: { version: 1, title: 'Lost?' },
    });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('conflict');
    expect(stale.body.error.current.version).toBe(2);
    expect(stale.body.error.current.title).toBe('Use a 10 mm² main cable');
    const revs = (await call(revisions, 'GET', { session: s.alumni, params: { id: r.id } })).body.revisions;
    expect(revs.map((v: { version: number }) => v.version)).toEqual([2, 1]);
    expect(revs[1].title).toBe('Use a 6 mm² main cable');
  });

  it('20 simultaneous edits of one version: exactly one wins, the rest get 409, one revision is added', async () => {
    const r = await create();
    const results = await Promise.all(
      Array.from({ length: 20 }, (_, i) =>
        call(recordRoute, 'PATCH', {
          session: s.member,
          params: { id: r.id },
          body: { version: 1, title: `Concurrent edit ${i}` },
        }),
      ),
    );
    const statuses = results.map((x) => x.status).sort();
    expect(statuses.filter((x) => x === 200)).toHaveLength(1);
    expect(statuses.filter((x) => x === 409)).toHaveLength(19);
    const revs = (await call(revisions, 'GET', { session: s.member, params: { id: r.id } })).body.revisions;
    expect(revs).toHaveLength(2);
  });

  it('members may not edit a past season’s record; alumni may not edit at all; 404 for no record', async () => {
    const past = await call(recordRoute, 'GET', {
      session: s.member,
      params: { id: 'demo-rec-2425-single-propeller' },
    });
    const v = past.body.record.version;
    expect(
      (
        await call(recordRoute, 'PATCH', {
          session: s.member,
          params: { id: 'demo-rec-2425-single-propeller' },
          body: { version: v, title: 'Rewrite history' },
        })
      ).status,
    ).toBe(403);
    const r = await create();
    expect(
      (
        await call(recordRoute, 'PATCH', {
          session: s.alumni,
          params: { id: r.id },
          body: { version: 1, title: 'Nope' },
        })
      ).status,
    ).toBe(403);
    expect(
      (
        await call(recordRoute, 'PATCH', {
          session: s.member,
          params: { id: 'nope' },
          body: { version: 1, title: 'Nope' },
        })
      ).status,
    ).toBe(404);
    expect(
      (await call(recordRoute, 'PATCH', { session: s.member, params: { id: r.id }, body: { title: 'No version' } }))
        .status,
    ).toBe(400);
  });
});

describe('status and lineage', () => {
  it('follows draft → proposed → accepted; refuses illegal moves with 409', async () => {
    const r = await create();
    expect(
      (await call(status, 'POST', { session: s.member, params: { id: r.id }, body: { status: 'accepted' } })).status,
    ).toBe(409);
    expect(
      (await call(status, 'POST', { session: s.member, params: { id: r.id }, body: { status: 'proposed' } })).status,
    ).toBe(200);
    const acc = await call(status, 'POST', { session: s.advisor, params: { id: r.id }, body: { status: 'accepted' } });
    expect(acc.body.record.status).toBe('accepted');
    expect(
      (await call(status, 'POST', { session: s.member, params: { id: r.id }, body: { status: 'open' } })).status,
    ).toBe(400);
  });

  it('superseding needs the replacing record, and both show the link', async () => {
    const old = await create();
    await call(status, 'POST', { session: s.member, params: { id: old.id }, body: { status: 'proposed' } });
    await call(status, 'POST', { session: s.advisor, params: { id: old.id }, body: { status: 'accepted' } });
    const missing = await call(status, 'POST', {
      session: s.member,
      params: { id: old.id },
      body: { status: 'superseded' },
    });
    expect(missing.status).toBe(400);
    expect(missing.body.error.issues[0].path).toBe('supersededBy');
    const newer = await create('member', { title: 'Use a 10 mm² main cable after all' });
    await call(status, 'POST', { session: s.member, params: { id: newer.id }, body: { status: 'proposed' } });
    await call(status, 'POST', { session: s.lead, params: { id: newer.id }, body: { status: 'accepted' } });
    const sup = await call(status, 'POST', {
      session: s.member,
      params: { id: old.id },
      body: { status: 'superseded', supersededBy: newer.id },
    });
    expect(sup.status).toBe(200);
    expect(sup.body.record.supersededBy.map((x: { id: string }) => x.id)).toEqual([newer.id]);
    const n = await call(recordRoute, 'GET', { session: s.alumni, params: { id: newer.id } });
    expect(n.body.record.supersedes.map((x: { id: string }) => x.id)).toEqual([old.id]);
    expect(
      (await call(status, 'POST', { session: s.member, params: { id: old.id }, body: { status: 'accepted' } })).status,
    ).toBe(409);
  });

  it('the demo lineage: the 2025–26 two-propeller decision supersedes 2024–25’s single propeller', async () => {
    const r = (await call(recordRoute, 'GET', { session: s.alumni, params: { id: 'demo-rec-2425-single-propeller' } }))
      .body.record;
    expect(r.status).toBe('superseded');
    expect(r.supersededBy.map((x: { id: string }) => x.id)).toContain('demo-rec-2526-two-propellers');
  });
});

describe('review and comments', () => {
  it('an advisor marks the current version reviewed; members may not', async () => {
    const r = await create();
    expect((await call(review, 'POST', { session: s.member, params: { id: r.id }, body: {} })).status).toBe(403);
    const ok = await call(review, 'POST', {
      session: s.advisor,
      params: { id: r.id },
      body: { note: 'Check the fuse rating too.' },
    });
    expect(ok.status).toBe(200);
    expect(ok.body.record.reviewed).toMatchObject({
      by: 'Dr. Felix Arnaud',
      version: 1,
      current: true,
      note: 'Check the fuse rating too.',
    });
  });

  it('alumni answer questions in comments; empty comments are refused', async () => {
    const r = await create();
    const q = await call(commentsRoute, 'POST', {
      session: s.member,
      params: { id: r.id },
      body: { body: 'Why not aluminium?' },
    });
    expect(q.status).toBe(201);
    const a = await call(commentsRoute, 'POST', {
      session: s.alumni,
      params: { id: r.id },
      body: { body: 'We tried in 2024: the lugs corroded.', parentId: q.body.comment.id },
    });
    expect(a.status).toBe(201);
    const list = await call(commentsRoute, 'GET', { session: s.advisor, params: { id: r.id } });
    expect(list.body.comments.map((c: { author: string }) => c.author)).toEqual(['Jonas Lindqvist', 'Priya Raman']);
    expect(
      (await call(commentsRoute, 'POST', { session: s.alumni, params: { id: r.id }, body: { body: '   ' } })).status,
    ).toBe(400);
    expect((await call(commentsRoute, 'POST', { params: { id: r.id }, body: { body: 'hi' } })).status).toBe(401);
  });

  it('every write is audited', async () => {
    const res = await call(audit, 'GET', { session: s.lead, query: { limit: '200', action: 'record.' } });
    const actions = new Set(res.body.entries.map((e: { action: string }) => e.action));
    for (const a of ['record.create', 'record.update', 'record.status', 'record.review', 'record.comment'])
      expect(actions).toContain(a);
  });
});

describe('attachments', () => {
  const png = new Uint8Array(readFileSync('content/demo/attachments/thrust-vs-rpm-2026-03.png'));
  const form = (bytes: Uint8Array, name: string, type = 'application/octet-stream') => {
    const f = new FormData();
    f.set('file', new File([new Uint8Array(bytes)], name, { type }));
    return f;
  };

  it('uploads a PNG and streams it back byte-identical, inline, with nosniff; 401 signed out', async () => {
    const r = await create();
    const up = await call(upload, 'POST', { session: s.member, params: { id: r.id }, rawBody: form(png, 'plot.png') });
    expect(up.status).toBe(201);
    expect(up.body.attachment).toMatchObject({
      fileName: 'plot.png',
      contentType: 'image/png',
      size: png.length,
      isImage: true,
    });
    const id = up.body.attachment.id;
    expect((await call(download, 'GET', { params: { id } })).status).toBe(401);
    const res = await call(download, 'GET', { session: s.alumni, params: { id } });
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('image/png');
    expect(res.headers.get('x-content-type-options')).toBe('nosniff');
    expect(res.headers.get('content-disposition')).toMatch(/^inline/);
    expect(Buffer.from(res.bytes).equals(Buffer.from(png))).toBe(true);
  });

  it('an image in the text shows only this record’s own attachment; the same body saves again unchanged', async () => {
    const r = await create();
    const other = await create();
    const up = await call(upload, 'POST', { session: s.member, params: { id: r.id }, rawBody: form(png, 'plot.png') });
    const theirs = await call(upload, 'POST', {
      session: s.member,
      params: { id: other.id },
      rawBody: form(png, 'plot.png'),
    });
    const withImage = (src: string) => ({
      type: 'doc',
      content: [
        { type: 'paragraph', content: [{ type: 'text', text: 'Thrust against rpm:' }] },
        { type: 'image', attrs: { src, alt: 'Thrust plot' } },
      ],
    });
    const own = `/api/attachments/${up.body.attachment.id}`;
    // A new record holds no attachment yet, so its text cannot show one.
    const created = await call(recordsRoute, 'POST', {
      session: s.member,
      body: newDecision({ body: withImage(own) }),
    });
    expect(created.status).toBe(400);
    expect(created.body.error.issues[0].path).toBe('body');
    for (const src of [
      `/api/attachments/${theirs.body.attachment.id}`,
      'https://example.org/a.png',
      'data:image/png;base64,AA==',
    ]) {
      const bad = await call(recordRoute, 'PATCH', {
        session: s.member,
        params: { id: r.id },
        body: { version: 1, body: withImage(src) },
      });
      expect(bad.status).toBe(400);
      expect(bad.body.error.code).toBe('invalid_input');
    }
    const ok = await call(recordRoute, 'PATCH', {
      session: s.member,
      params: { id: r.id },
      body: { version: 1, body: withImage(own) },
    });
    expect(ok.status).toBe(200);
    expect(ok.body.record.bodyHtml).toBe(
      `<p>Thrust against rpm:</p><img loading="lazy" src="${own}" alt="Thrust plot">`,
    );
    // Saving what came back (as the editor does) keeps the image.
    const again = await call(recordRoute, 'PATCH', {
      session: s.member,
      params: { id: r.id },
      body: { version: 2, body: ok.body.record.body },
    });
    expect(again.status).toBe(200);
    expect(again.body.record.body).toEqual(ok.body.record.body);
    expect(again.body.record.bodyHtml).toBe(ok.body.record.bodyHtml);
  });

  it('CSV is told from the bytes and downloads as an attachment; the bytes come back unchanged', async () => {
    const r = await create();
    const csv = new TextEncoder().encode('time_s,current_A\n0,10\n1,12.5\n');
    const up = await call(upload, 'POST', { session: s.member, params: { id: r.id }, rawBody: form(csv, 'log.csv') });
    expect(up.body.attachment.contentType).toBe('text/csv');
    const res = await call(download, 'GET', { session: s.member, params: { id: up.body.attachment.id } });
    expect(res.text).toBe('time_s,current_A\n0,10\n1,12.5\n');
    expect(res.headers.get('content-disposition')).toMatch(/^attachment/);
  });

  it('415 for a disguised binary, 413 over the size limit, 403 for alumni, 400 without a file', async () => {
    const r = await create();
    const exe = new Uint8Array([0x4d, 0x5a, 0x90, 0x00, 0x03, 0x00, 0x00, 0x00]);
    const bad = await call(upload, 'POST', {
      session: s.member,
      params: { id: r.id },
      rawBody: form(exe, 'photo.png', 'image/png'),
    });
    expect(bad.status).toBe(415);
    expect(bad.body.error.code).toBe('unsupported_type');
    const big = new Uint8Array(20 * 1024 * 1024 + 10);
    big.set([0x25, 0x50, 0x44, 0x46, 0x2d]);
    const tooBig = await call(upload, 'POST', {
      session: s.member,
      params: { id: r.id },
      rawBody: form(big, 'big.pdf'),
    });
    expect(tooBig.status).toBe(413);
    expect(
      (await call(upload, 'POST', { session: s.alumni, params: { id: r.id }, rawBody: form(png, 'plot.png') })).status,
    ).toBe(403);
    expect(
      (await call(upload, 'POST', { session: s.member, params: { id: r.id }, rawBody: new FormData() })).status,
    ).toBe(400);
  });
});
