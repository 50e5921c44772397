// `npm start`: serves the built app (npm run build first).
//   1. settings validated, migrations applied and, with WAKEBOOK_DEMO=1, the demo seeded — before listening
//      (src/lib/server/prepare.ts, bundled into dist/prepare/);
//   2. the browser assets in dist/client answered by sirv (hashed files under /_astro/ cached for a year);
//   3. everything else handed to Astro through @astrojs/node's documented middleware-mode handler, with the
//      socket's address in locals (src/lib/server/client-address.ts decides whether to trust X-Forwarded-For).
// Runtime flags (NODE_ENV, heap) are set in package.json's start command, not here.
import { readFileSync } from 'node:fs';
import http from 'node:http';
import https from 'node:https';
import { fileURLToPath } from 'node:url';
import sirv from 'sirv';

const dist = new URL('../dist/', import.meta.url);

let settings;
try {
  const { prepare } = await import(new URL('prepare/prepare.mjs', dist).href);
  settings = await prepare();
} catch (error) {
  if (error?.code === 'ERR_MODULE_NOT_FOUND') console.error('No build found: run `npm run build` first.');
  else console.error(error instanceof Error ? error.message : error);
  process.exit(1);
}

const { handler } = await import(new URL('server/entry.mjs', dist).href);
const assets = sirv(fileURLToPath(new URL('client/', dist)), {
  etag: true,
  setHeaders(res, pathname) {
    // Vite names these files by their content hash: a changed file gets a new name.
    if (pathname.startsWith('/_astro/')) res.setHeader('cache-control', 'public, max-age=31536000, immutable');
    // The service worker and the manifest keep their names across builds: the browser asks again every time.
    else if (pathname === '/sw.js' || pathname === '/manifest.webmanifest') res.setHeader('cache-control', 'no-cache');
  },
});

const listener = (req, res) => {
  assets(req, res, () => handler(req, res, undefined, { socketAddress: req.socket.remoteAddress }));
};
const tls = settings.SERVER_CERT_PATH && settings.SERVER_KEY_PATH;
const server = tls
  ? https.createServer(
      { cert: readFileSync(settings.SERVER_CERT_PATH), key: readFileSync(settings.SERVER_KEY_PATH) },
      listener,
    )
  : http.createServer(listener);

const { HOST: host, PORT: port } = settings;
server.listen(port, host, () => {
  const shown = host.includes(':') ? `[${host}]` : host;
  console.log(`Wakebook listening on ${tls ? 'https' : 'http'}://${shown}:${port}`);
});

// A stop signal lets requests in flight finish, then exits; SQLite in WAL mode needs nothing more.
const stop = () => {
  server.close(() => process.exit(0));
  server.closeIdleConnections();
  setTimeout(() => process.exit(0), 5000).unref();
};
process.once('SIGTERM', stop);
process.once('SIGINT', stop);
