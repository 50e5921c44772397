// Large and streamed uploads: the body is read as it arrives, stopped at the size limit, never held whole.
import { describe, it, expect, beforeAll, afterEach, onTestFinished } from 'vitest';
import { createHash } from 'node:crypto';
import { existsSync, readdirSync, rmSync, statSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { eq } from 'drizzle-orm';
import { call, callRaw } from '../setup/http';
import { seedDemo, sessionsForAllRoles, type DemoRole } from '../setup/db';
import * as recordsRoute from '../../src/pages/api/records/index';
import * as upload from '../../src/pages/api/records/[id]/attachments';
import * as download from '../../src/pages/api/attachments/[id]';
import { templateFor } from '../../src/lib/editor/templates';
import { resetSettingsForTests, settings } from '../../src/lib/server/config';
import { db } from '../../src/lib/server/db/client';
import { attachments } from '../../src/lib/server/db/schema';
import { pathForHash } from '../../src/lib/server/storage';

const MB = 1024 * 1024;
const BOUNDARY = '----wakebook-upload-test-7f3a9c';
let s: Record<DemoRole, string>;
let recordId = '';

beforeAll(async () => {
  await seedDemo();
  s = await sessionsForAllRoles();
  const res = await call(recordsRoute, 'POST', {
    session: s.member,
    body: { kind: 'decision', title: 'Motor controller log', subsystem: 'battery', body: templateFor('decision') },
  });
  expect(res.status).toBe(201);
  recordId = res.body.record.id;
});

const original = process.env.WAKEBOOK_MAX_UPLOAD_MB;
function setLimitMb(mb: number) {
  process.env.WAKEBOOK_MAX_UPLOAD_MB = String(mb);
  resetSettingsForTests();
}
afterEach(() => {
  if (original === undefined) delete process.env.WAKEBOOK_MAX_UPLOAD_MB;
  else process.env.WAKEBOOK_MAX_UPLOAD_MB = original;
  resetSettingsForTests();
});

/** Every file under the uploads folder (stored files and anything left behind). */
function uploadedFiles(dir = resolve(settings().WAKEBOOK_UPLOADS)): string[] {
  if (!existsSync(dir)) return [];
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) =>
    e.isDirectory() ? uploadedFiles(join(dir, e.name)) : [join(dir, e.name)],
  );
}

/**
 * A multipart body of one PDF-looking file of `total` bytes, produced 64 KiB at a time only when the reader
 * asks (no content-length, like a chunked upload). Counts the file bytes handed out and hashes them.
 */
function streamedPdf(total: number, fileName = 'big.pdf') {
  const enc = new TextEncoder();
  const head = enc.encode(
    `--${BOUNDARY}\r\nContent-Disposition: form-data; name="file"; filename="${fileName}"\r\n` +
      'Content-Type: application/pdf\r\n\r\n',
  );
  const tail = enc.encode(`\r\n--${BOUNDARY}--\r\n`);
  // Pseudo-random bytes (a fixed xorshift stream) never contain the boundary.
  const block = new Uint8Array(64 * 1024);
  let x = 0x9e3779b9;
  for (let i = 0; i < block.length; i++) {
    x ^= x << 13;
    x ^= x >>> 17;
    x ^= x << 5;
    block[i] = x & 0xff;
  }
  const state = { handedOut: 0, pulls: 0 };
  const hash = createHash('sha256');
  let sentHead = false;
  let sentTail = false;
  const body = new ReadableStream<Uint8Array>(
    {
      pull(controller) {
        state.pulls++;
        if (!sentHead) {
          sentHead = true;
          controller.enqueue(head);
          return;
        }
        if (state.handedOut < total) {
          const n = Math.min(block.length, total - state.handedOut);
          const chunk = block.slice(0, n);
          if (state.handedOut === 0) chunk.set(enc.encode('%PDF-1.7\n'));
          state.handedOut += n;
          hash.update(chunk);
          controller.enqueue(chunk);
          return;
        }
        if (!sentTail) {
          sentTail = true;
          controller.enqueue(tail);
          return;
        }
        controller.close();
      },
    },
    { highWaterMark: 0 },
  );
  return {
    body,
    state,
    headers: { 'content-type': `multipart/form-data; boundary=${BOUNDARY}` },
    sha256: () => hash.digest('hex'),
  };
}

const liveBytes = () => {
  const m = process.memoryUsage();
  return m.heapUsed + m.arrayBuffers;
};

describe('streamed uploads', () => {
  it('413 for an over-limit chunked upload, stopped near the limit; nothing is left in the uploads folder', async () => {
    setLimitMb(1);
    const before = uploadedFiles();
    const src = streamedPdf(64 * MB);
    const res = await call(upload, 'POST', {
      session: s.member,
      params: { id: recordId },
      headers: src.headers,
      rawBody: src.body,
    });
    expect(res.status).toBe(413);
    expect(res.body.error).toMatchObject({ code: 'too_large', issues: [] });
    expect(res.body.error.message).toMatch(/1 MB/);
    // Read up to the limit and a little read-ahead, not the 64 MB that were on offer.
    expect(src.state.handedOut).toBeGreaterThan(1 * MB);
    expect(src.state.handedOut).toBeLessThan(4 * MB);
    expect(uploadedFiles()).toEqual(before);
  });

  it('a 300 MB upload under the limit is stored byte-identical with flat memory, and streams back from disk', async () => {
    setLimitMb(400);
    const total = 300 * MB;
    // However the test ends, the 300 MB do not stay behind in the temporary folder.
    onTestFinished(() => {
      for (const f of uploadedFiles()) if (statSync(f).size >= total) rmSync(f);
    });
    const src = streamedPdf(total, 'hull-scan.pdf');
    const baseline = liveBytes();
    let peak = baseline;
    const sample = () => {
      peak = Math.max(peak, liveBytes());
    };
    const timer = setInterval(sample, 5);
    const pulled = src.body.getReader();
    // Samples on the data path too, since a tight read loop can starve the interval timer.
    const sampled = new ReadableStream<Uint8Array>({
      async pull(controller) {
        const { done, value } = await pulled.read();
        if (src.state.pulls % 32 === 0) sample();
        if (done) controller.close();
        else controller.enqueue(value);
      },
      cancel: (reason) => pulled.cancel(reason),
    });
    let res;
    try {
      res = await call(upload, 'POST', {
        session: s.member,
        params: { id: recordId },
        headers: src.headers,
        rawBody: sampled,
      });
    } finally {
      clearInterval(timer);
    }
    expect(res.status).toBe(201);
    expect(src.state.handedOut).toBe(total);
    const growth = (peak - baseline) / MB;
    expect(growth, `memory grew by ${growth.toFixed(1)} MB during the upload`).toBeLessThan(64);

    const sha256 = src.sha256();
    expect(res.body.attachment).toMatchObject({
      fileName: 'hull-scan.pdf',
      contentType: 'application/pdf',
      size: total,
    });
    const row = db().select().from(attachments).where(eq(attachments.id, res.body.attachment.id)).get()!;
    expect(row.sha256).toBe(sha256);
    const stored = pathForHash(sha256);
    expect(statSync(stored).size).toBe(total);

    // The download is a stream from disk: hash it chunk by chunk, and memory stays flat here as well.
    const { response } = await callRaw(download, 'GET', { session: s.alumni, params: { id: row.id } });
    expect(response.status).toBe(200);
    expect(response.headers.get('content-length')).toBe(String(total));
    const back = createHash('sha256');
    const downloadBase = liveBytes();
    let downloadPeak = downloadBase;
    let received = 0;
    for await (const chunk of response.body as unknown as AsyncIterable<Uint8Array>) {
      back.update(chunk);
      received += chunk.byteLength;
      downloadPeak = Math.max(downloadPeak, liveBytes());
    }
    expect(received).toBe(total);
    expect(back.digest('hex')).toBe(sha256);
    expect((downloadPeak - downloadBase) / MB).toBeLessThan(64);
    // Only the stored file is left: no temporary copy beside it.
    expect(uploadedFiles().filter((f) => !/[0-9a-f]{64}$/.test(f))).toEqual([]);
  }, 180_000);

  it('415 for a disguised binary and 400 for an empty file leave no temporary file behind', async () => {
    const before = uploadedFiles();
    const send = (bytes: Uint8Array, name: string) => {
      const f = new FormData();
      f.set('file', new File([new Uint8Array(bytes)], name));
      return call(upload, 'POST', { session: s.member, params: { id: recordId }, rawBody: f });
    };
    const exe = await send(new Uint8Array([0x4d, 0x5a, 0x90, 0x00, 0x03, 0x00, 0x00, 0x00]), 'photo.png');
    expect(exe.status).toBe(415);
    expect(exe.body.error.code).toBe('unsupported_type');
    const empty = await send(new Uint8Array(), 'empty.csv');
    expect(empty.status).toBe(400);
    expect(empty.body.error.code).toBe('invalid_input');
    expect(uploadedFiles()).toEqual(before);
  });

  it('400 (not 500) for a body that is not multipart, or multipart without a boundary or cut short', async () => {
    const bodies: [Record<string, string>, BodyInit][] = [
      [{ 'content-type': 'application/json' }, '{"file":"x"}'],
      [{ 'content-type': 'multipart/form-data' }, 'no boundary'],
      [
        { 'content-type': `multipart/form-data; boundary=${BOUNDARY}` },
        `--${BOUNDARY}\r\nContent-Disposition: form-data; name="file"; filename="a.txt"\r\n\r\nhalf a fi`,
      ],
    ];
    for (const [headers, rawBody] of bodies) {
      const res = await call(upload, 'POST', { session: s.member, params: { id: recordId }, headers, rawBody });
      expect(res.status, JSON.stringify(headers)).toBe(400);
      expect(res.body.error.code).toBe('invalid_input');
    }
  });

  it('keeps a UTF-8 file name, and keeps the extension when a long name is cut', async () => {
    const f = new FormData();
    f.set('file', new File([new TextEncoder().encode('Notes from the tank test.\n')], 'Prüfstand-Notizen.txt'));
    const up = await call(upload, 'POST', { session: s.member, params: { id: recordId }, rawBody: f });
    expect(up.status).toBe(201);
    expect(up.body.attachment.fileName).toBe('Prüfstand-Notizen.txt');

    const long = `${'motor-temperature-run-'.repeat(12)}final.csv`;
    const g = new FormData();
    g.set('file', new File([new TextEncoder().encode('time_s,temp_C\n0,20\n1,21\n')], long));
    const cut = await call(upload, 'POST', { session: s.member, params: { id: recordId }, rawBody: g });
    expect(cut.status).toBe(201);
    expect(cut.body.attachment.fileName.length).toBeLessThanOrEqual(180);
    expect(cut.body.attachment.fileName).toMatch(/^motor-temperature-run-.*\.csv$/);
  });
});
