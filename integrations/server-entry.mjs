// The built server's entry (copied to dist/server/entry.mjs by integrations/boot-at-start.mjs).
//
// Astro renders pages through @astrojs/node in "middleware" mode; this file owns the HTTP server around it:
//   1. production mode before any library is imported;
//   2. settings, migrations and the demo seed before listening (a bad setting stops here, named);
//   3. the built browser assets (dist/client, about a megabyte) read into memory once, so a request for a
//      page never touches the disk to ask "is this a file?" (the standalone adapter checks every request);
//   4. everything else goes to Astro.
import './wakebook-production-env.mjs';
import { readFileSync } from 'node:fs';
import http from 'node:http';
import https from 'node:https';
import { fileURLToPath } from 'node:url';
import { loadAssets, serveAsset } from './wakebook-static-assets.mjs';

async function main() {
  const { handler } = await import('./app.mjs');
  try {
    await import('./_astro-internal_middleware.mjs');
    await globalThis.__wakebookBoot?.();
  } catch (error) {
    console.error(error instanceof Error ? error.message : error);
    process.exit(1);
  }
  const frontDoor = globalThis.__wakebookFrontDoor;
  const assets = loadAssets(fileURLToPath(new URL('../client/', import.meta.url)));
  const answer = (req, res) => {
    // The front door (src/lib/server/front-door.ts) checks the session and answers cached reads before Astro.
    if (frontDoor)
      frontDoor(req, res, handler).catch((error) => {
        console.error(error);
        if (!res.headersSent) res.writeHead(500, { 'content-type': 'text/plain; charset=utf-8' });
        res.end('Something went wrong on our side.');
      });
    else handler(req, res);
  };
  // Requests start in the order they arrived, at most IN_FLIGHT at a time, from a queue emptied between turns of
  // the event loop. Started as soon as they are parsed, a render-heavy load let some requests wait many rounds
  // behind newer ones (p99 twenty times the median at 50 connections, even for a plain Node server doing 2 ms of
  // work per answer; see bench/http.ts), and a render that yields (React's server renderer does) went to the back of
  // the line each time. A request holds its place until its answer is sent, or for SLOW_MS at most, so a slow upload
  // or download never holds the others up for long.
  const IN_FLIGHT = 8;
  const SLOW_MS = 500;
  const waiting = [];
  /** Requests started and not yet answered, oldest first, with the time they started. */
  const running = new Map();
  let scheduled = false;
  const pump = () => {
    if (!scheduled && waiting.length > 0 && running.size < IN_FLIGHT) {
      scheduled = true;
      setImmediate(startWaiting);
    }
  };
  const release = (res) => {
    if (running.delete(res)) pump();
  };
  const startWaiting = () => {
    scheduled = false;
    while (waiting.length > 0 && running.size < IN_FLIGHT) {
      const req = waiting.shift();
      const res = waiting.shift();
      if (req.destroyed) continue;
      running.set(res, performance.now());
      res.once('finish', () => release(res));
      res.once('close', () => release(res));
      answer(req, res);
    }
    pump();
  };
  // Slow answers give up their place (checked a few times a second rather than with a timer per request).
  setInterval(() => {
    const old = performance.now() - SLOW_MS;
    for (const [res, at] of running) {
      if (at > old) break;
      release(res);
    }
  }, 100).unref();
  const listener = (req, res) => {
    try {
      decodeURI(req.url);
    } catch {
      res.writeHead(400, { 'content-type': 'text/plain; charset=utf-8' });
      res.end('Bad request.');
      return;
    }
    if (serveAsset(assets, req, res)) return;
    waiting.push(req, res);
    pump();
  };
  const tls = process.env.SERVER_CERT_PATH && process.env.SERVER_KEY_PATH;
  const server = tls
    ? https.createServer({ cert: readFileSync(process.env.SERVER_CERT_PATH), key: readFileSync(process.env.SERVER_KEY_PATH) }, listener)
    : http.createServer(listener);
  const host = process.env.HOST || '127.0.0.1';
  const port = Number(process.env.PORT || 4321);
  server.listen(port, host, () => {
    console.log(`Wakebook listening on ${tls ? 'https' : 'http'}://${host.includes(':') ? `[${host}]` : host}:${port}`);
  });
  // A stop signal lets requests in flight finish, then exits; SQLite in WAL mode needs nothing more.
  const stop = () => {
    server.close(() => process.exit(0));
    server.closeIdleConnections();
    setTimeout(() => process.exit(0), 5000).unref();
  };
  process.once('SIGTERM', stop);
  process.once('SIGINT', stop);
}

await main();
