import { describe, it, expect, beforeAll } from 'vitest';
import { mkdtempSync, mkdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { loadAssets, serveAsset } from '../../integrations/static-assets.mjs';

interface Sent {
  status?: number;
  headers?: Record<string, string>;
  body?: Buffer;
  ended: boolean;
}

function fakeRes(): Sent & { writeHead: (s: number, h: Record<string, string>) => void; end: (b?: Buffer) => void } {
  const sent: Sent = { ended: false };
  return Object.assign(sent, {
    writeHead(status: number, headers: Record<string, string>) {
      sent.status = status;
      sent.headers = headers;
    },
    end(body?: Buffer) {
      sent.body = body;
      sent.ended = true;
    },
  });
}

let assets: Map<string, unknown>;
beforeAll(() => {
  const dir = mkdtempSync(join(tmpdir(), 'wakebook-assets-'));
  mkdirSync(join(dir, '_astro'));
  writeFileSync(join(dir, '_astro', 'app.abc123.js'), 'console.log(1)');
  writeFileSync(join(dir, 'favicon.svg'), '<svg/>');
  assets = loadAssets(dir);
});

describe('built assets served from memory', () => {
  it('serves a hashed file as immutable with its type and length', () => {
    const res = fakeRes();
    expect(serveAsset(assets, { method: 'GET', url: '/_astro/app.abc123.js?v=1', headers: {} }, res)).toBe(true);
    expect(res.status).toBe(200);
    expect(res.headers?.['content-type']).toBe('text/javascript; charset=utf-8');
    expect(res.headers?.['cache-control']).toContain('immutable');
    expect(res.headers?.['x-content-type-options']).toBe('nosniff');
    expect(res.body?.toString()).toBe('console.log(1)');
  });

  it('answers 304 to a matching etag and sends no body to HEAD', () => {
    const first = fakeRes();
    serveAsset(assets, { method: 'GET', url: '/favicon.svg', headers: {} }, first);
    expect(first.headers?.['cache-control']).toBe('public, max-age=0, must-revalidate');
    const again = fakeRes();
    serveAsset(
      assets,
      { method: 'GET', url: '/favicon.svg', headers: { 'if-none-match': first.headers?.etag } },
      again,
    );
    expect(again.status).toBe(304);
    const head = fakeRes();
    serveAsset(assets, { method: 'HEAD', url: '/favicon.svg', headers: {} }, head);
    expect(head.status).toBe(200);
    expect(head.body).toBeUndefined();
  });

  it('leaves pages, writes and unknown paths to the app', () => {
    for (const req of [
      { method: 'GET', url: '/records', headers: {} },
      { method: 'POST', url: '/favicon.svg', headers: {} },
      { method: 'GET', url: '/_astro/../../etc/passwd', headers: {} },
      { method: 'GET', url: '/%E0%A4%A', headers: {} },
    ]) {
      const res = fakeRes();
      expect(serveAsset(assets, req, res)).toBe(false);
      expect(res.ended).toBe(false);
    }
  });
});
