// `npm start` (scripts/start.mjs) against the build: settings are checked, migrations applied and the demo seeded
// before the server listens; the browser assets come from sirv, with hashed files cached for good; the rest is Astro.
import { describe, it, expect } from 'vitest';
import { spawn } from 'node:child_process';
import { mkdtempSync, readdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import Database from 'better-sqlite3';
import { inject } from 'vitest';

function freshEnv(extra: Record<string, string> = {}) {
  const dir = mkdtempSync(join(tmpdir(), 'wakebook-start-'));
  return {
    ...process.env,
    NODE_ENV: 'production',
    HOST: '127.0.0.1',
    PORT: String(5000 + Math.floor(Math.random() * 400)),
    WAKEBOOK_DB: join(dir, 'start.db'),
    WAKEBOOK_UPLOADS: join(dir, 'uploads'),
    WAKEBOOK_DEMO: '1',
    ...extra,
  };
}

/** Runs the start file until it prints its listening line (or exits); returns what it printed. */
function startUntilListening(env: NodeJS.ProcessEnv) {
  const child = spawn(process.execPath, ['scripts/start.mjs'], { env, stdio: ['ignore', 'pipe', 'pipe'] });
  let out = '';
  let err = '';
  child.stderr.on('data', (d: Buffer) => (err += d.toString()));
  return new Promise<{ listening: boolean; code: number | null; out: string; err: string; stop: () => void }>(
    (resolve) => {
      child.stdout.on('data', (d: Buffer) => {
        out += d.toString();
        if (out.includes('listening on')) resolve({ listening: true, code: null, out, err, stop: () => child.kill() });
      });
      child.on('exit', (code) => resolve({ listening: false, code, out, err, stop: () => {} }));
    },
  );
}

describe('npm start', () => {
  it('a bad setting stops it before it listens, with the setting named', async () => {
    const run = await startUntilListening(freshEnv({ PORT: 'eighty' }));
    expect(run.listening).toBe(false);
    expect(run.code).not.toBe(0);
    expect(run.err).toContain('PORT');
    const tls = await startUntilListening(freshEnv({ SERVER_CERT_PATH: '/tmp/only-the-cert.pem' }));
    expect(tls.listening).toBe(false);
    expect(tls.err).toContain('SERVER_KEY_PATH');
  });

  it('migrates and seeds the demo before it listens', async () => {
    const env = freshEnv();
    const run = await startUntilListening(env);
    try {
      expect(run.listening).toBe(true);
      // At the moment it says it listens, the database already holds the migrated schema and the demo team.
      const sqlite = new Database(env.WAKEBOOK_DB, { readonly: true });
      const users = sqlite.prepare('select count(*) from users').pluck().get() as number;
      sqlite.close();
      expect(users).toBeGreaterThanOrEqual(4);
      const base = `http://127.0.0.1:${env.PORT}`;
      const health = await fetch(`${base}/api/health`);
      expect(health.status).toBe(200);
      // The start file hands the socket's address to the app: a forged X-Forwarded-For on every attempt does not
      // reset the per-address sign-in limit (30 failures per address in 15 minutes).
      const statuses: number[] = [];
      for (let i = 0; i < 32; i++) {
        const res = await fetch(`${base}/api/auth/sign-in`, {
          method: 'POST',
          headers: { 'content-type': 'application/json', 'x-forwarded-for': `198.51.100.${i}` },
          body: JSON.stringify({ email: `nobody${i}@example.org`, password: 'not-the-password' }),
        });
        statuses.push(res.status);
      }
      expect(statuses.slice(0, 30).every((s) => s === 401)).toBe(true);
      expect(statuses.slice(30)).toEqual([429, 429]);
    } finally {
      run.stop();
    }
  });

  it('serves hashed assets with immutable caching and everything else through Astro', async () => {
    const base = inject('e2eBaseUrl');
    const asset = readdirSync('dist/client/_astro').find((f) => f.endsWith('.js'))!;
    const res = await fetch(`${base}/_astro/${asset}`);
    expect(res.status).toBe(200);
    expect(res.headers.get('cache-control')).toBe('public, max-age=31536000, immutable');
    expect(res.headers.get('content-type')).toContain('javascript');
    const again = await fetch(`${base}/_astro/${asset}`, { headers: { 'if-none-match': res.headers.get('etag')! } });
    expect(again.status).toBe(304);
    const page = await fetch(`${base}/sign-in`);
    expect(page.status).toBe(200);
    // No inline script on any page, so the policy allows our own files and nothing else (issue 12, 2.3).
    expect(page.headers.get('content-security-policy')).toMatch(/script-src 'self'$/);
    const missing = await fetch(`${base}/no-such-page`);
    expect(missing.status).toBe(404);
  });
});
