// Importing documents: a fixture folder made here (Word, Markdown, HTML with a script, text, PDF, a zip of them, a
// duplicate, a broken file, zip bombs) goes through POST /api/imports; every stored draft is checked.
import { describe, it, expect, beforeAll, afterEach } from 'vitest';
import { eq } from 'drizzle-orm';
import { randomBytes } from 'node:crypto';
import { PDFDocument } from 'pdf-lib';
import { existsSync, readdirSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { call } from '../setup/http';
import { seedDemo, sessionsForAllRoles, type DemoRole } from '../setup/db';
import { makeDocx, makePdf, makePng, makeZip } from '../setup/documents';
import * as importsRoute from '../../src/pages/api/imports/index';
import * as importRoute from '../../src/pages/api/imports/[id]';
import * as recordRoute from '../../src/pages/api/records/[id]/index';
import * as download from '../../src/pages/api/attachments/[id]';
import * as seasonsRoute from '../../src/pages/api/seasons/index';
import * as audit from '../../src/pages/api/audit';
import { importsSettled, resumeImports } from '../../src/lib/server/imports/queue';
import { TEXT_LIMITS } from '../../src/lib/server/imports/convert';
import { db } from '../../src/lib/server/db/client';
import { importItems, imports, users } from '../../src/lib/server/db/schema';
import { storeBytes } from '../../src/lib/server/storage';
import { resetSettingsForTests, settings } from '../../src/lib/server/config';

/** Files still in the uploads folder's incoming/ (half-received uploads). */
function incomingFiles(): string[] {
  const dir = join(resolve(settings().WAKEBOOK_UPLOADS), 'incoming');
  return existsSync(dir) ? readdirSync(dir) : [];
}

let s: Record<DemoRole, string>;
let seasons: { id: string; name: string; current: boolean; startsOn: string }[] = [];
const current = () => seasons.find((x) => x.current)!;
const seasonNamed = (name: string) => seasons.find((x) => x.name === name)!;

beforeAll(async () => {
  await seedDemo();
  s = await sessionsForAllRoles();
  seasons = (await call(seasonsRoute, 'GET', { session: s.lead })).body.seasons;
});

type FileSpec = [string, Uint8Array | string];

function form(files: FileSpec[], fields: Record<string, string> = {}) {
  const f = new FormData();
  for (const [k, v] of Object.entries({ subsystem: 'hull', kind: 'decision', ...fields })) f.set(k, v);
  for (const [name, bytes] of files)
    f.append('file', new Blob([typeof bytes === 'string' ? bytes : new Uint8Array(bytes)]), name);
  return f;
}

async function importFiles(role: DemoRole | null, files: FileSpec[], fields: Record<string, string> = {}) {
  return call(importsRoute, 'POST', { session: role ? s[role] : undefined, rawBody: form(files, fields) });
}

/** Imports, waits for the queue, and returns the finished import as GET /api/imports/{id} answers it. */
async function importAndWait(role: DemoRole, files: FileSpec[], fields: Record<string, string> = {}) {
  const res = await importFiles(role, files, fields);
  expect(res.status, res.text).toBe(202);
  await importsSettled();
  const got = await call(importRoute, 'GET', { session: s[role], params: { id: res.body.import.id } });
  expect(got.status).toBe(200);
  expect(got.body.import.state).toBe('done');
  return { started: res.body.import, done: got.body.import };
}

async function record(id: string) {
  const res = await call(recordRoute, 'GET', { session: s.lead, params: { id } });
  expect(res.status).toBe(200);
  return res.body.record;
}

const png = makePng(6, 4);
const markdown =
  '# Fairing the transom\n\nWe sanded to **220 grit** and used *two coats*; see [the log](https://example.org/log).\n\n' +
  '## Steps\n\n1. Fill\n2. Sand\n\n| Coat | Hours |\n| --- | --- |\n| Primer | 4 |\n| Top | 6 |\n';
const hostileHtml =
  '<!doctype html><html><head><title>Propeller shaft seal</title><meta name="date" content="2024-02-10">' +
  '<script>alert("head")</script></head><body><h1>Propeller shaft seal</h1>' +
  '<p onclick="alert(1)" style="color:red">Grease the seal <a href="javascript:alert(2)">every run</a> and ' +
  '<a href="https://example.org/seal" onmouseover="alert(3)">read the maker</a>.</p>' +
  '<script>document.cookie="x"</script><img src="x" onerror="alert(4)">' +
  `<img src="data:image/png;base64,${png.toString('base64')}" alt="seal photo">` +
  '<img src="https://example.org/pixel.png" alt="maker pixel"><img src="javascript:alert(5)" alt="bad">' +
  `<p><img src="data:image/png;base64,${Buffer.from('not a picture at all').toString('base64')}" alt="fake"></p>` +
  '<iframe src="https://example.org"></iframe><ul><li>Check weekly</li></ul></body></html>';
/** Every image node in a stored document, with its attributes that are set. */
function imagesOf(n: { type?: string; attrs?: Record<string, unknown>; content?: unknown[] }): unknown[] {
  const own =
    n.type === 'image'
      ? [Object.fromEntries(Object.entries(n.attrs ?? {}).filter(([, v]) => v !== null && v !== undefined))]
      : [];
  return [...own, ...(n.content ?? []).flatMap((c) => imagesOf(c as typeof n))];
}
const text = 'Battery box lid\nkeeps rain out\n\nSecond paragraph of the note.';

describe('POST /api/imports: who may, and bad requests', () => {
  it('401 without a session, 403 for advisors and alumni', async () => {
    expect((await importFiles(null, [['a.md', '# A note']])).status).toBe(401);
    for (const role of ['advisor', 'alumni'] as const) {
      const res = await importFiles(role, [['a.md', '# A note']]);
      expect(res.status).toBe(403);
      expect(res.body.error.code).toBe('forbidden');
    }
  });

  it('400 with field issues for a missing subsystem, a wrong kind, an unknown season or no file', async () => {
    const f = new FormData();
    f.append('file', new Blob(['# x']), 'x.md');
    const noFields = await call(importsRoute, 'POST', { session: s.member, rawBody: f });
    expect(noFields.status).toBe(400);
    expect(noFields.body.error.issues.map((i: { path: string }) => i.path).sort()).toEqual(['kind', 'subsystem']);
    const unknown = await importFiles('member', [['x.md', '# x']], { subsystem: 'no-such-part' });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.issues[0].path).toBe('subsystem');
    const season = await importFiles('member', [['x.md', '# x']], { seasonId: 'nosuchseason' });
    expect(season.status).toBe(400);
    expect(season.body.error.issues[0].path).toBe('seasonId');
    const none = await importFiles('member', []);
    expect(none.status).toBe(400);
    expect(none.body.error.issues[0].path).toBe('file');
    const json = await call(importsRoute, 'POST', { session: s.member, body: { subsystem: 'hull' } });
    expect(json.status).toBe(400);
  });

  it('403 when a member names a past season; a lead may', async () => {
    const past = seasons.find((x) => !x.current)!;
    const member = await importFiles('member', [['x.md', '# Member past']], { seasonId: past.id });
    expect(member.status).toBe(403);
    const { done } = await importAndWait('lead', [['lead-past.md', '# Lead writes into the past']], {
      seasonId: past.id,
    });
    expect((await record(done.items[0].recordId)).seasonId).toBe(past.id);
  });

  it('415 when nothing sent can be imported; nothing is written', async () => {
    const before = db().select().from(imports).all().length;
    const res = await importFiles('member', [
      ['photo.png', png],
      ['sheet.xlsx', 'PK not really'],
    ]);
    expect(res.status).toBe(415);
    expect(res.body.error.code).toBe('unsupported_type');
    expect(db().select().from(imports).all().length).toBe(before);
  });
});

describe('a fixture folder imported', () => {
  let docx: Buffer;
  let pdf: Uint8Array;
  let result: Awaited<ReturnType<typeof importAndWait>>;
  const byName = (name: string) => result.done.items.find((i: { fileName: string }) => i.fileName === name);

  beforeAll(async () => {
    docx = await makeDocx({
      title: 'Hull laminate report',
      created: '2024-05-20T09:00:00Z',
      heading: 'Layup findings',
      paragraphs: ['the second layer wrinkled at the chine.'],
      bullets: ['Vacuum bag the chine', 'Warm the resin'],
      table: [
        ['Layer', 'Weight (g/m²)'],
        ['Outer', '200'],
        ['Core', '400'],
      ],
      image: { png, alt: 'chine close-up' },
    });
    pdf = await makePdf('Tank test summary', new Date('2023-11-15T10:00:00Z'), [
      'Tank test at the university basin.',
      'Resistance at 4 m/s was lower than predicted.',
    ]);
    result = await importAndWait('lead', [
      ['laminate.docx', docx],
      ['transom.md', markdown],
      ['seal.html', hostileHtml],
      ['battery-lid.txt', text],
      ['tank-test.pdf', pdf],
      ['broken.docx', 'this is not a zip at all'],
      ['spreadsheet.xlsx', 'PK'],
    ]);
  });

  it('answers 202 at once with every file queued or already failed, then finishes them all', () => {
    expect(result.started.total).toBe(7);
    expect(result.started.items).toHaveLength(7);
    expect(result.started.items.map((i: { state: string }) => i.state)).toEqual([
      'queued',
      'queued',
      'queued',
      'queued',
      'queued',
      'queued',
      'failed',
    ]);
    expect(result.done.done).toBe(7);
    expect(result.done.finishedAt).not.toBeNull();
    for (const item of result.started.items) expect(item.size).toBeGreaterThan(0);
  });

  it('Word: title from the document, heading, list, table as text, image attached and shown inline, original attached', async () => {
    const item = byName('laminate.docx');
    expect(item.state).toBe('done');
    const r = await record(item.recordId);
    expect(r.title).toBe('Hull laminate report');
    expect(r.kind).toBe('decision');
    expect(r.status).toBe('draft');
    expect(r.subsystem).toBe('hull');
    expect(r.author.name).toBeTruthy();
    const lead = db().select().from(users).where(eq(users.email, 'lead@wakebook.test')).get()!;
    expect(r.author.id).toBe(lead.id);
    // The lead may write anywhere: the document's own date (May 2024) picks the 2023–24 season.
    expect(r.seasonId).toBe(seasonNamed('2023–24').id);
    expect(r.bodyHtml).toContain('<h2>Layup findings</h2>');
    expect(r.bodyHtml).toMatch(/<ul><li><p>Vacuum bag the chine<\/p><\/li><li><p>Warm the resin<\/p><\/li><\/ul>/);
    expect(r.bodyHtml).toContain('<strong>Note: </strong>');
    expect(r.bodyHtml).toContain('<pre><code>| Layer | Weight (g/m²) |');
    expect(r.bodyHtml).toContain('| Outer | 200           |');
    const image = r.attachments.find((a: { isImage: boolean }) => a.isImage);
    expect(image).toBeDefined();
    expect(image.contentType).toBe('image/png');
    // The image stands where it stood in the document, as an image node showing its attachment.
    expect(imagesOf(r.body)).toEqual([{ src: `/api/attachments/${image.id}`, alt: 'chine close-up' }]);
    expect(r.bodyHtml).toContain(`</pre><img loading="lazy" src="/api/attachments/${image.id}" alt="chine close-up">`);
    expect(r.bodyHtml).not.toContain('Image: chine close-up');
    const imageBytes = await call(download, 'GET', { session: s.member, params: { id: image.id } });
    expect(Buffer.from(imageBytes.bytes).equals(png)).toBe(true);
    const original = r.attachments.find((a: { fileName: string }) => a.fileName === 'laminate.docx');
    expect(original.contentType).toBe('application/vnd.openxmlformats-officedocument.wordprocessingml.document');
    const originalBytes = await call(download, 'GET', { session: s.member, params: { id: original.id } });
    expect(Buffer.from(originalBytes.bytes).equals(docx)).toBe(true);
  });

  it('Markdown: first heading as title (not repeated), bold, italic, links, ordered list, table as text', async () => {
    const r = await record(byName('transom.md').recordId);
    expect(r.title).toBe('Fairing the transom');
    expect(r.bodyHtml).not.toContain('Fairing the transom');
    expect(r.bodyHtml).toContain('<strong>220 grit</strong>');
    expect(r.bodyHtml).toContain('<em>two coats</em>');
    expect(r.bodyHtml).toContain('href="https://example.org/log"');
    expect(r.bodyHtml).toContain('<h2>Steps</h2>');
    expect(r.bodyHtml).toMatch(/<ol><li><p>Fill<\/p><\/li><li><p>Sand<\/p><\/li><\/ol>/);
    expect(r.bodyHtml).toContain('| Primer | 4     |');
    expect(r.seasonId).toBe(current().id);
    expect(r.attachments.map((a: { fileName: string }) => a.fileName)).toEqual(['transom.md']);
  });

  it('HTML: no script, event attribute, javascript: link or iframe survives; its data: image becomes an attachment', async () => {
    const r = await record(byName('seal.html').recordId);
    expect(r.title).toBe('Propeller shaft seal');
    const stored = JSON.stringify(r.body) + r.bodyHtml;
    for (const bad of [
      '<script',
      'alert',
      'onclick',
      'onmouseover',
      'onerror',
      'javascript:',
      'iframe',
      'style=',
      'cookie',
    ])
      expect(stored.toLowerCase()).not.toContain(bad);
    expect(r.bodyHtml).toContain('Grease the seal every run and');
    expect(r.bodyHtml).toContain('href="https://example.org/seal"');
    expect(r.bodyHtml).toContain('<li><p>Check weekly</p></li>');
    const image = r.attachments.find((a: { isImage: boolean }) => a.isImage);
    expect(image.fileName).toMatch(/seal photo/);
    // Only the carried image is shown, from its attachment; the web picture stays a link, the script one goes.
    expect(imagesOf(r.body)).toEqual([{ src: `/api/attachments/${image.id}`, alt: 'seal photo' }]);
    expect(r.bodyHtml).toContain(`</p><img loading="lazy" src="/api/attachments/${image.id}" alt="seal photo"><p>`);
    expect(r.bodyHtml).not.toMatch(/<img[^>]+src="(?!\/api\/attachments\/)/);
    expect(r.bodyHtml).not.toContain('data:');
    // A "picture" whose bytes are not one is not kept: its place holds its words, no image of a missing file.
    expect(r.bodyHtml).toContain('<p>[image: fake]</p>');
    expect(r.attachments.filter((a: { isImage: boolean }) => a.isImage)).toHaveLength(1);
    expect(r.bodyHtml).toContain('href="https://example.org/pixel.png">Image: maker pixel</a>[image: bad]');
    // The page's meta date (February 2024) falls in 2023–24.
    expect(r.seasonId).toBe(seasonNamed('2023–24').id);
  });

  it('text: paragraphs at blank lines, line breaks kept, title from the file name', async () => {
    const r = await record(byName('battery-lid.txt').recordId);
    expect(r.title).toBe('battery-lid');
    expect(r.bodyHtml).toBe('<p>Battery box lid<br>keeps rain out</p><p>Second paragraph of the note.</p>');
  });

  it('PDF: its text, its title and date, and the PDF attached', async () => {
    const r = await record(byName('tank-test.pdf').recordId);
    expect(r.title).toBe('Tank test summary');
    expect(r.bodyHtml).toContain('Resistance at 4 m/s was lower than predicted.');
    expect(r.seasonId).toBe(seasonNamed('2023–24').id);
    const original = r.attachments.find((a: { contentType: string }) => a.contentType === 'application/pdf');
    expect(original.fileName).toBe('tank-test.pdf');
  });

  it('a broken file and an unknown type fail with a sentence naming the file; the rest went on', () => {
    const broken = byName('broken.docx');
    expect(broken.state).toBe('failed');
    expect(broken.message).toMatch(/^broken\.docx was not imported: it is not a Word \(\.docx\) file/);
    expect(broken.recordId).toBeNull();
    const xlsx = byName('spreadsheet.xlsx');
    expect(xlsx.state).toBe('failed');
    expect(xlsx.message).toContain('spreadsheet.xlsx was not imported');
  });

  it('the same bytes again, by someone else, are skipped naming the record that holds them', async () => {
    const again = await importAndWait('member', [['copy-of-transom.md', markdown]]);
    const item = again.done.items[0];
    expect(item.state).toBe('skipped');
    expect(item.message).toContain('“Fairing the transom”');
    expect(item.recordId).toBe(byName('transom.md').recordId);
  });

  it('once the record holding the bytes is discarded, the same file imports again', async () => {
    const first = await importAndWait('member', [['discard-me.md', '# Short-lived note\n\nText.']]);
    const id = first.done.items[0].recordId;
    expect((await call(recordRoute, 'DELETE', { session: s.member, params: { id } })).status).toBe(204);
    const again = await importAndWait('member', [['discard-me.md', '# Short-lived note\n\nText.']]);
    expect(again.done.items[0].state).toBe('done');
    expect(again.done.items[0].recordId).not.toBe(id);
  });

  it('a zip of a folder: each document one draft; folders, __MACOSX and .DS_Store left out; entry dates used', async () => {
    const zip = await makeZip(
      [
        ['archive/', ''],
        ['archive/motor/notes.md', '# Motor mount\n\nBolts torqued to 25 N·m.'],
        ['archive/motor/wiring.txt', 'Wiring loom\n\nUse tinned copper.'],
        ['archive/old.docx', await makeDocx({ heading: 'Rudder stock', paragraphs: ['stainless, 20 mm.'] })],
        ['archive/.DS_Store', 'junk'],
        ['__MACOSX/archive/._notes.md', 'junk'],
        ['archive/logo.png', png],
      ],
      new Date('2024-12-01T12:00:00Z'),
    );
    const { done } = await importAndWait('lead', [['archive.zip', zip]], { kind: 'lesson', subsystem: 'propulsion' });
    expect(done.items.map((i: { fileName: string }) => i.fileName)).toEqual([
      'archive/motor/notes.md',
      'archive/motor/wiring.txt',
      'archive/old.docx',
      'archive/logo.png',
    ]);
    expect(done.items.map((i: { state: string }) => i.state)).toEqual(['done', 'done', 'done', 'failed']);
    const notes = await record(done.items[0].recordId);
    expect(notes.title).toBe('Motor mount');
    expect(notes.kind).toBe('lesson');
    expect(notes.status).toBe('open'); // a lesson has no draft status: it starts open, like a typed one
    expect(notes.subsystem).toBe('propulsion');
    // The zip entry's date (December 2024) falls in 2024–25.
    expect(notes.seasonId).toBe(seasonNamed('2024–25').id);
    const rudder = await record(done.items[2].recordId);
    expect(rudder.title).toBe('Rudder stock');
  });

  it('a member importing a dated document lands in the current season (members write only there)', async () => {
    const old = await makeDocx({ heading: 'Member old doc', created: '2024-01-05T00:00:00Z', paragraphs: ['x.'] });
    const { done } = await importAndWait('member', [['member-old.docx', old]]);
    const r = await record(done.items[0].recordId);
    expect(r.seasonId).toBe(current().id);
    expect(r.status).toBe('draft');
  });

  it('audits the import and each record imported', async () => {
    const res = await call(audit, 'GET', { session: s.lead, query: { limit: '100' } });
    const actions = res.body.entries.map((e: { action: string }) => e.action);
    expect(actions).toContain('import.start');
    expect(actions).toContain('record.import');
    const start = res.body.entries.find((e: { action: string }) => e.action === 'import.start');
    expect(start.actionText).toBe('started importing');
    expect(start.targetTitle).toMatch(/^\d+ files? into /);
  });
});

describe('GET /api/imports and /api/imports/{id}', () => {
  it('the importer and a lead may follow an import; another member may not; unknown is 404', async () => {
    const res = await importFiles('member', [['follow.md', '# Followed note']]);
    expect(res.status).toBe(202);
    await importsSettled();
    const id = res.body.import.id;
    expect((await call(importRoute, 'GET', { session: s.lead, params: { id } })).status).toBe(200);
    expect((await call(importRoute, 'GET', { session: s.advisor, params: { id } })).status).toBe(403);
    expect((await call(importRoute, 'GET', { params: { id } })).status).toBe(401);
    expect((await call(importRoute, 'GET', { session: s.member, params: { id: 'nosuchimport' } })).status).toBe(404);
    const list = await call(importsRoute, 'GET', { session: s.member });
    expect(list.status).toBe(200);
    expect(list.body.imports[0].id).toBe(id);
    expect(list.body.imports[0]).toMatchObject({ state: 'done', total: 1, done: 1 });
  });

  it('an import cut off by a restart goes on when resumed', async () => {
    const member = db().select().from(users).where(eq(users.email, 'member@wakebook.test')).get()!;
    const { sha256, size } = storeBytes(Buffer.from('# Left waiting\n\nA note from before the restart.'));
    const now = new Date();
    db()
      .insert(imports)
      .values({
        id: 'resumeimport1',
        userId: member.id,
        subsystemSlug: 'hull',
        kind: 'decision',
        state: 'running',
        total: 1,
        done: 0,
        createdAt: now,
      })
      .run();
    db()
      .insert(importItems)
      .values({
        id: 'resumeitem1',
        importId: 'resumeimport1',
        position: 0,
        fileName: 'waiting.md',
        size,
        sha256,
        createdAt: now,
      })
      .run();
    expect(resumeImports()).toBe(1);
    await importsSettled();
    const got = await call(importRoute, 'GET', { session: s.member, params: { id: 'resumeimport1' } });
    expect(got.body.import.state).toBe('done');
    expect(got.body.import.items[0].state).toBe('done');
    expect((await record(got.body.import.items[0].recordId)).title).toBe('Left waiting');
  });
});

describe('limits', () => {
  const saved = { ...process.env };
  function setEnv(values: Record<string, string>) {
    Object.assign(process.env, values);
    resetSettingsForTests();
  }
  afterEach(() => {
    for (const k of [
      'WAKEBOOK_MAX_UPLOAD_MB',
      'WAKEBOOK_IMPORT_MAX_FILES',
      'WAKEBOOK_IMPORT_TOTAL_MB',
      'WAKEBOOK_IMPORT_ZIP_MB',
    ])
      if (saved[k] === undefined) delete process.env[k];
      else process.env[k] = saved[k];
    resetSettingsForTests();
  });

  it('a zip bomb (one entry compressed 1000 to 1) is refused whole with 413; nothing is written', async () => {
    const before = db().select().from(imports).all().length;
    const bomb = await makeZip([
      ['fine.md', '# fine'],
      ['zeros.txt', Buffer.alloc(40 * 1024 * 1024)],
    ]);
    expect(bomb.length).toBeLessThan(200 * 1024);
    const res = await importFiles('member', [
      ['ok.md', '# also fine'],
      ['bomb.zip', bomb],
    ]);
    expect(res.status).toBe(413);
    expect(res.body.error.message).toContain('zip bomb');
    expect(db().select().from(imports).all().length).toBe(before);
    // Nothing half-received is left behind in the uploads folder.
    expect(incomingFiles()).toEqual([]);
  });

  it('a zip that declares more than the unzipped limit is refused with 413 before anything is inflated', async () => {
    const zip = await makeZip([['small.md', '# small']]);
    // The central directory's uncompressed size (offset 24 of its header) says 3 GB.
    const cd = zip.lastIndexOf(Buffer.from([0x50, 0x4b, 0x01, 0x02]));
    zip.writeUInt32LE(3_000_000_000, cd + 24);
    const res = await importFiles('member', [['huge.zip', zip]]);
    expect(res.status).toBe(413);
    expect(res.body.error.message).toMatch(/over 500 MB unzipped/);
  });

  it('a Word file that is a zip bomb inside fails alone, unopened', async () => {
    const bomb = await makeZip([
      ['word/document.xml', Buffer.alloc(40 * 1024 * 1024, 0x20)],
      ['docProps/core.xml', '<x/>'],
    ]);
    const { done } = await importAndWait('member', [
      ['inflated.docx', bomb],
      ['beside-it.md', '# Beside the bomb'],
    ]);
    expect(done.items[0].state).toBe('failed');
    expect(done.items[0].message).toMatch(/^inflated\.docx was not imported: it is not a Word file we can open safely/);
    expect(done.items[1].state).toBe('done');
  });

  it('a zip over the zip limit: 413, and nothing left behind', async () => {
    setEnv({ WAKEBOOK_IMPORT_ZIP_MB: '0.01' });
    const zip = await makeZip([['noise.txt', randomBytes(20_000).toString('base64')]]);
    const res = await importFiles('member', [['big.zip', zip]]);
    expect(res.status).toBe(413);
    expect(res.body.error.message).toContain('big.zip is over 0.01 MB');
    expect(incomingFiles()).toEqual([]);
  });

  it('a file over the size limit: 413', async () => {
    setEnv({ WAKEBOOK_MAX_UPLOAD_MB: '0.01' });
    const res = await importFiles('member', [['big.txt', 'x'.repeat(20_000)]]);
    expect(res.status).toBe(413);
    expect(res.body.error.message).toContain('big.txt');
  });

  it('more files than an import holds: 413 (counting the files inside a zip)', async () => {
    setEnv({ WAKEBOOK_IMPORT_MAX_FILES: '3' });
    const four = await importFiles(
      'member',
      ['a', 'b', 'c', 'd'].map((n) => [`${n}.md`, `# ${n}`] as FileSpec),
    );
    expect(four.status).toBe(413);
    const zip = await makeZip(['a', 'b', 'c', 'd'].map((n) => [`${n}.md`, `# note ${n}`] as FileSpec));
    const zipped = await importFiles('member', [['four.zip', zip]]);
    expect(zipped.status).toBe(413);
  });

  it('a text longer than a record can hold is refused before it is parsed (parsing takes tens of times its size)', async () => {
    const word = (i: number) => (i * 2654435761).toString(36).slice(-6);
    const paragraph = (n: number) => Array.from({ length: 40 }, (_, i) => word(n * 40 + i)).join(' ');
    // A Word file whose document part unzips to just over 8 MB (varied words: not compressible enough to be a bomb).
    const longWord = await makeDocx({
      heading: 'Long',
      paragraphs: Array.from({ length: 23_000 }, (_, n) => paragraph(n)),
    });
    const html = `<html><body><p>${paragraph(1)}</p>${' '.repeat(TEXT_LIMITS.html)}</body></html>`;
    const text = 'x'.repeat(TEXT_LIMITS.text + 1);
    const { done } = await importAndWait('member', [
      ['long.docx', longWord],
      ['long.html', html],
      ['long.md', text],
      ['long.txt', text],
      ['short.md', '# Short enough'],
    ]);
    type Item = { fileName: string; state: string; message: string };
    const byName = new Map((done.items as Item[]).map((i) => [i.fileName, i]));
    const message = (name: string) => byName.get(name)?.message;
    expect(byName.get('long.docx')).toMatchObject({ state: 'failed' });
    expect(message('long.docx')).toMatch(
      /^long\.docx was not imported: it is too long for one record: 9 MB of document text, over the limit of 8 MB/,
    );
    expect(message('long.html')).toMatch(
      /^long\.html was not imported: it is too long for one record: 5 MB of web page, over the limit of 4 MB/,
    );
    expect(message('long.md')).toMatch(
      /^long\.md was not imported: it is too long for one record: 3 MB of Markdown, over the limit of 2 MB/,
    );
    expect(message('long.txt')).toMatch(
      /^long\.txt was not imported: it is too long for one record: 3 MB of text, over the limit of 2 MB/,
    );
    expect(byName.get('short.md')).toMatchObject({ state: 'done' });
  });

  it('a PDF of more pages than a record could hold is refused before its text is read', async () => {
    const doc = await PDFDocument.create();
    for (let i = 0; i < TEXT_LIMITS.pdfPages + 1; i++) doc.addPage([200, 200]);
    const { done } = await importAndWait('member', [['many-pages.pdf', await doc.save()]]);
    expect(done.items[0].state).toBe('failed');
    expect(done.items[0].message).toMatch(
      /^many-pages\.pdf was not imported: it is too long for one record: 1001 pages, over the limit of 1000/,
    );
  });

  it('a file inside a zip over the size limit fails alone', async () => {
    setEnv({ WAKEBOOK_MAX_UPLOAD_MB: '0.01' });
    const zip = await makeZip([
      ['big.txt', 'lorem ipsum '.repeat(2000)],
      ['small.md', '# Small one in a zip'],
    ]);
    const { done } = await importAndWait('member', [['mixed.zip', zip]]);
    expect(done.items[0].state).toBe('failed');
    expect(done.items[0].message).toMatch(/big\.txt was not imported: it is over 0\.01 MB/);
    expect(done.items[1].state).toBe('done');
  });
});
