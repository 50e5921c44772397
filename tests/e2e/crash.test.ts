// No lost data: kill the built server with SIGKILL in the middle of a stream of writes, start it again on the
// same files, and check that every write it acknowledged is there and the database is intact.
import { describe, it, expect } from 'vitest';
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import Database from 'better-sqlite3';

const PORT = 4900 + Math.floor(Math.random() * 90);
const dir = mkdtempSync(join(tmpdir(), 'wakebook-crash-'));
const env = {
  ...process.env,
  NODE_ENV: 'production',
  HOST: '127.0.0.1',
  PORT: String(PORT),
  WAKEBOOK_DB: join(dir, 'crash.db'),
  WAKEBOOK_UPLOADS: join(dir, 'uploads'),
  WAKEBOOK_DEMO: '1',
};
const base = `http://127.0.0.1:${PORT}`;

async function start(): Promise<ChildProcess> {
  const child = spawn(process.execPath, ['scripts/start.mjs'], { env, stdio: 'ignore' });
  for (let i = 0; i < 300; i++) {
    try {
      if ((await fetch(`${base}/api/health`)).ok) return child;
    } catch {
      // not yet listening
    }
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error('server did not start');
}

async function session(): Promise<string> {
  const res = await fetch(`${base}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email: 'member@wakebook.test', password: 'wakebook-demo' }),
  });
  return res.headers
    .getSetCookie()
    .find((c) => c.startsWith('wakebook_session='))!
    .split(';')[0];
}

describe('crash safety', () => {
  it('every acknowledged write survives SIGKILL, and PRAGMA integrity_check is ok', async () => {
    let server = await start();
    const cookie = await session();
    const acknowledged: string[] = [];
    let stop = false;
    const writer = async (w: number) => {
      for (let i = 0; !stop && i < 10_000; i++) {
        const body = `crash-test writer ${w} comment ${i}`;
        try {
          const res = await fetch(`${base}/api/records/demo-rec-2526-two-propellers/comments`, {
            method: 'POST',
            headers: { 'content-type': 'application/json', cookie },
            body: JSON.stringify({ body }),
          });
          if (res.status === 201) acknowledged.push(body);
        } catch {
          return; // the server died under us: this write was never acknowledged
        }
      }
    };
    const writers = [0, 1, 2, 3].map(writer);
    // Kill it mid-stream, once a fair number of writes have been acknowledged (however busy the machine is).
    const until = Date.now() + 30_000;
    while (acknowledged.length < 40 && Date.now() < until) await new Promise((r) => setTimeout(r, 50));
    server.kill('SIGKILL');
    stop = true;
    await Promise.all(writers);
    // The exit event may already have fired while the writers were failing.
    if (server.exitCode === null && server.signalCode === null) await new Promise((r) => server.once('exit', r));
    expect(acknowledged.length).toBeGreaterThan(20);

    // Integrity straight from the files the killed process left behind.
    const raw = new Database(env.WAKEBOOK_DB);
    expect(raw.pragma('integrity_check', { simple: true })).toBe('ok');
    raw.close();

    server = await start();
    const cookie2 = await session();
    const res = await fetch(`${base}/api/records/demo-rec-2526-two-propellers/comments`, {
      headers: { cookie: cookie2 },
    });
    const stored = new Set(((await res.json()) as { comments: { body: string }[] }).comments.map((c) => c.body));
    const lost = acknowledged.filter((b) => !stored.has(b));
    expect(lost).toEqual([]);
    server.kill('SIGTERM');
  }, 120_000);
});
