import { describe, it, expect, beforeAll } from 'vitest';
import { readdirSync, writeFileSync, mkdtempSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { tmpdir } from 'node:os';
import Database from 'better-sqlite3';
import { parse as parseYaml } from 'yaml';
import { isNull, count } from 'drizzle-orm';
import { call } from '../setup/http';
import { unzip } from '../setup/zip';
import { seedDemo, sessionsForAllRoles, type DemoRole } from '../setup/db';
import * as exportRoute from '../../src/pages/api/export';
import * as backupRoute from '../../src/pages/api/backup';
import * as audit from '../../src/pages/api/audit';
import * as uploadRoute from '../../src/pages/api/records/[id]/attachments';
import * as recordRoute from '../../src/pages/api/records/[id]/index';
import { db } from '../../src/lib/server/db/client';
import { attachments, calculations, records, users } from '../../src/lib/server/db/schema';
import { openStored } from '../../src/lib/server/storage';

let s: Record<DemoRole, string>;
beforeAll(async () => {
  await seedDemo();
  s = await sessionsForAllRoles();
});

function frontMatter(md: string): Record<string, unknown> {
  const m = /^---\n([\s\S]*?)\n---\n/.exec(md);
  if (!m) throw new Error('no front matter');
  return parseYaml(m[1]);
}

describe('GET /api/export', () => {
  let files: Map<string, Buffer>;
  let root = '';

  beforeAll(async () => {
    const res = await call(exportRoute, 'GET', { session: s.lead });
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('application/zip');
    expect(res.headers.get('content-disposition')).toMatch(
      /attachment; filename="wakebook-handover-\d{4}-\d{2}-\d{2}\.zip"/,
    );
    expect(res.headers.get('content-length')).toBeNull(); // streamed: the size is not known up front
    files = await unzip(res.bytes);
    root = [...files.keys()][0].split('/')[0];
  });

  const get = (name: string) => files.get(`${root}/${name}`);

  it('has an index in Markdown and HTML that links every record', () => {
    const index = get('index.md')!.toString('utf8');
    const html = get('index.html')!.toString('utf8');
    expect(index).toMatch(/^# Wakebook handover bundle/);
    const recordFiles = [...files.keys()].filter((k) => k.startsWith(`${root}/records/`));
    for (const f of recordFiles) {
      const rel = f.slice(root.length + 1);
      expect(index).toContain(`](${rel})`);
      expect(html).toContain(`href="${rel}"`);
    }
    expect(index).toContain('## People by season');
  });

  it('has one Markdown file per live record with front matter and the body converted from the editor document', () => {
    const live = db().select({ n: count() }).from(records).where(isNull(records.deletedAt)).get()!.n;
    const recordFiles = [...files.keys()].filter((k) => /\/records\/.+\.md$/.test(k));
    expect(live).toBeGreaterThan(0);
    expect(recordFiles).toHaveLength(live);
    const dbRecords = db().select().from(records).all();
    for (const f of recordFiles) {
      const md = files.get(f)!.toString('utf8');
      const fm = frontMatter(md);
      const row = dbRecords.find((r) => r.id === fm.id)!;
      expect(row).toBeDefined();
      expect(fm).toMatchObject({ kind: row.kind, status: row.status, subsystem: row.subsystemSlug });
      for (const key of [
        'season',
        'author',
        'created',
        'updated',
        'calculations',
        'related',
        'supersedes',
        'supersededBy',
      ])
        expect(fm).toHaveProperty(key);
      expect(md).toContain(`# ${row.title}`);
      // The first words of the stored plain text appear in the Markdown body, in order.
      const norm = (x: string) => x.replace(/[\\*_~`[\]]/g, ''); // Markdown markers and escapes, not words
      const plain = norm(md);
      let at = plain.indexOf(`# ${row.title}`);
      for (const word of row.bodyText.split(/\s+/).filter(Boolean).slice(0, 12)) {
        const next = plain.indexOf(norm(word), at);
        expect(next, `"${word}" after position ${at} in ${f}`).toBeGreaterThan(at);
        at = next;
      }
    }
    // Links inside bodies lead to the other files of the bundle, not to the app.
    const all = recordFiles.map((f) => files.get(f)!.toString('utf8')).join('\n');
    expect(all).not.toMatch(/\]\(\/records\//);
    expect(all).toMatch(/\]\(\.\.\/records\/[a-z0-9-]+\.md\)/);
    const linked = recordFiles
      .map((f) => frontMatter(files.get(f)!.toString('utf8')))
      .find((fm) => (fm.supersedes as string[]).length > 0);
    expect(linked).toBeDefined();
  });

  it('has every guide as its MDX source', () => {
    const dir = 'src/content/guides';
    const sources = readdirSync(dir, { recursive: true })
      .map(String)
      .filter((f) => f.endsWith('.mdx'));
    const guides = [...files.keys()].filter((k) => k.startsWith(`${root}/guides/`));
    expect(guides).toHaveLength(sources.length);
    for (const src of sources) {
      const name = src.split('/').pop()!;
      const entry = guides.find((g) => g.endsWith(`/${name}`))!;
      expect(files.get(entry)!.toString('utf8')).toBe(readFileSync(join(dir, src), 'utf8'));
    }
  });

  it('has JSON for each saved calculation with inputs, latest outputs, engine version and history', () => {
    const saved = db().select().from(calculations).where(isNull(calculations.deletedAt)).all();
    const jsons = [...files.keys()].filter((k) => k.startsWith(`${root}/calculations/`));
    expect(jsons).toHaveLength(saved.length);
    for (const j of jsons) {
      const data = JSON.parse(files.get(j)!.toString('utf8'));
      const row = saved.find((c) => c.id === data.id)!;
      expect(data.inputs).toEqual(row.inputs);
      expect(typeof data.latest.engineVersion).toBe('string');
      expect(Object.keys(data.latest.outputs).length).toBeGreaterThan(0);
      expect(data.results.length).toBeGreaterThanOrEqual(1);
    }
  });

  it('has every attachment byte for byte, in a folder per record', async () => {
    const stored = db().select().from(attachments).all();
    expect(stored.length).toBeGreaterThan(0);
    for (const a of stored) {
      const entry = [...files.keys()].find(
        (k) => k.includes(`/attachments/`) && k.includes(a.recordId) && k.endsWith(a.fileName),
      )!;
      expect(entry).toBeDefined();
      const original = Buffer.from(await new Response(openStored(a.sha256)!.stream).arrayBuffer());
      expect(files.get(entry)!.equals(original)).toBe(true);
    }
  });

  it('is audited with what it contained', async () => {
    const log = await call(audit, 'GET', { session: s.lead, query: { action: 'export.' } });
    expect(log.body.entries[0].action).toBe('export.run');
    expect(log.body.entries[0].detail.records).toBeGreaterThan(0);
  });

  it.each(['advisor', 'member', 'alumni'] as const)('refuses %s with 403', async (role) => {
    expect((await call(exportRoute, 'GET', { session: s[role] })).status).toBe(403);
  });

  it('refuses a signed-out caller with 401', async () => {
    expect((await call(exportRoute, 'GET')).status).toBe(401);
  });
});

describe('attachment names in the bundle', () => {
  it('name each file by its sniffed type, so an uploaded ".html" never opens as a page from the unzipped folder', async () => {
    const record = db().select().from(records).where(isNull(records.deletedAt)).get()!;
    const send = async (text: string, name: string) => {
      const f = new FormData();
      f.set('file', new File([new TextEncoder().encode(text)], name, { type: 'text/html' }));
      const res = await call(uploadRoute, 'POST', { session: s.lead, params: { id: record.id }, rawBody: f });
      expect(res.status).toBe(201);
      return res.body.attachment as { id: string; contentType: string };
    };
    const csv = await send('time_s,current_A\n0,10\n1,12\n', 'log.html');
    const page = await send('<p>hi</p><script>alert(document.cookie)</script>\n', 'notes.HTM');
    const named = await send('Tank test notes.\n', 'tank-test.txt');
    expect([csv.contentType, page.contentType, named.contentType]).toEqual(['text/csv', 'text/plain', 'text/plain']);

    const res = await call(exportRoute, 'GET', { session: s.lead });
    const names = [...(await unzip(res.bytes)).keys()];
    const folder = names
      .filter((k) => k.includes('/attachments/') && k.includes(record.id))
      .map((k) => k.split('/').pop());
    expect(folder).toEqual(expect.arrayContaining(['log.html.csv', 'notes.HTM.txt', 'tank-test.txt']));
    expect(names.filter((k) => /\.html?$/i.test(k) && !k.endsWith('/index.html'))).toEqual([]);
    // The record's page in the bundle links the renamed file.
    const md = names.find((k) => k.endsWith('.md') && k.includes(record.id) && k.includes('/records/'))!;
    const text = (await unzip(res.bytes)).get(md)!.toString('utf8');
    expect(text).toContain('log.html.csv');
  });
});

describe('images in a record’s text in the bundle', () => {
  it('write Markdown that shows the attachment file in the record’s folder, with the description', async () => {
    const record = db().select().from(records).where(isNull(records.deletedAt)).all().at(-1)!;
    const f = new FormData();
    const png = readFileSync('content/demo/attachments/thrust-vs-rpm-2026-03.png');
    f.set('file', new File([new Uint8Array(png)], 'thrust plot.png', { type: 'image/png' }));
    const up = await call(uploadRoute, 'POST', { session: s.lead, params: { id: record.id }, rawBody: f });
    expect(up.status).toBe(201);
    const body = {
      type: 'doc',
      content: [
        { type: 'paragraph', content: [{ type: 'text', text: 'Thrust against rpm:' }] },
        { type: 'image', attrs: { src: `/api/attachments/${up.body.attachment.id}`, alt: 'Thrust plot' } },
      ],
    };
    const saved = await call(recordRoute, 'PATCH', {
      session: s.lead,
      params: { id: record.id },
      body: { version: record.version, body },
    });
    expect(saved.status).toBe(200);
    const res = await call(exportRoute, 'GET', { session: s.lead });
    const zip = await unzip(res.bytes);
    const names = [...zip.keys()];
    const md = names.find((k) => k.endsWith('.md') && k.includes(record.id) && k.includes('/records/'))!;
    const text = zip.get(md)!.toString('utf8');
    const m = /!\[Thrust plot\]\(\.\.\/(attachments\/[^)]+\/thrust%20plot\.png)\)/.exec(text);
    expect(m).not.toBeNull();
    const root = md.slice(0, md.indexOf('/records/'));
    expect(names).toContain(`${root}/${decodeURI(m![1])}`);
  });
});

describe('GET /api/backup', () => {
  it('streams a consistent SQLite copy that opens and holds the same data, and audits it', async () => {
    const res = await call(backupRoute, 'GET', { session: s.lead });
    expect(res.status).toBe(200);
    expect(res.headers.get('content-disposition')).toMatch(/wakebook-backup-\d{8}-\d{4}\.db/);
    expect(Number(res.headers.get('content-length'))).toBe(res.bytes.byteLength);
    expect(Buffer.from(res.bytes.subarray(0, 16)).toString('latin1')).toBe('SQLite format 3\u0000');
    const file = join(mkdtempSync(join(tmpdir(), 'wakebook-restore-')), 'restored.db');
    writeFileSync(file, res.bytes);
    const copy = new Database(file, { readonly: true });
    const n = (copy.prepare('select count(*) as n from users').get() as { n: number }).n;
    const r = (copy.prepare('select count(*) as n from records').get() as { n: number }).n;
    copy.close();
    expect(n).toBe(db().select({ n: count() }).from(users).get()!.n);
    expect(r).toBe(db().select({ n: count() }).from(records).get()!.n);
    const log = await call(audit, 'GET', { session: s.lead, query: { action: 'backup.' } });
    expect(log.body.entries[0].action).toBe('backup.run');
  });

  it.each(['advisor', 'member', 'alumni'] as const)('refuses %s with 403', async (role) => {
    expect((await call(backupRoute, 'GET', { session: s[role] })).status).toBe(403);
  });
});
