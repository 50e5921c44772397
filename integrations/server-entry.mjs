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
import { createRequestQueue } from './wakebook-request-queue.mjs';

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
  // Requests start in arrival order, a few at a time (integrations/request-queue.mjs explains why).
  const enqueue = createRequestQueue(answer);
  const listener = (req, res) => {
    try {
      decodeURI(req.url);
    } catch {
      res.writeHead(400, { 'content-type': 'text/plain; charset=utf-8' });
      res.end('Bad request.');
      return;
    }
    if (serveAsset(assets, req, res)) return;
    enqueue(req, res);
  };
  const tls = process.env.SERVER_CERT_PATH && process.env.SERVER_KEY_PATH;
  const server = tls
    ? https.createServer(
        { cert: readFileSync(process.env.SERVER_CERT_PATH), key: readFileSync(process.env.SERVER_KEY_PATH) },
        listener,
      )
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
