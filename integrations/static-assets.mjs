// Serves the built browser assets (dist/client) from memory: read once at start, so a page request never
// touches the disk to ask whether it names a file. Used by integrations/server-entry.mjs.
import { createHash } from 'node:crypto';
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative, sep } from 'node:path';

const TYPES = {
  '.js': 'text/javascript; charset=utf-8',
  '.mjs': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.svg': 'image/svg+xml',
  '.png': 'image/png',
  '.ico': 'image/x-icon',
  '.woff': 'font/woff',
  '.woff2': 'font/woff2',
  '.txt': 'text/plain; charset=utf-8',
  '.json': 'application/json',
  '.webmanifest': 'application/manifest+json',
};

// Assets answer with the same safety headers as pages (src/lib/server/security-headers.ts).
const ASSET_HEADERS = {
  'x-content-type-options': 'nosniff',
  'referrer-policy': 'same-origin',
  'x-frame-options': 'DENY',
  'content-security-policy': "default-src 'none'; style-src 'self' 'unsafe-inline'; frame-ancestors 'none'",
};

/** Every file under dir, keyed by its URL path, with its bytes and headers ready to send. */
export function loadAssets(dir) {
  const assets = new Map();
  const walk = (d) => {
    for (const entry of readdirSync(d, { withFileTypes: true })) {
      const full = join(d, entry.name);
      if (entry.isDirectory()) walk(full);
      else if (entry.isFile() && !entry.name.startsWith('.')) {
        const body = readFileSync(full);
        const path = '/' + relative(dir, full).split(sep).join('/');
        const ext = entry.name.slice(entry.name.lastIndexOf('.')).toLowerCase();
        const etag = `"${createHash('sha1').update(body).digest('base64url').slice(0, 16)}"`;
        assets.set(path, {
          body,
          etag,
          headers: {
            ...ASSET_HEADERS,
            'content-type': TYPES[ext] ?? 'application/octet-stream',
            'content-length': String(body.length),
            etag,
            'last-modified': statSync(full).mtime.toUTCString(),
            // Files under /_astro/ carry a content hash in their names; the rest may change between releases.
            'cache-control': path.startsWith('/_astro/')
              ? 'public, max-age=31536000, immutable'
              : 'public, max-age=0, must-revalidate',
          },
        });
      }
    }
  };
  try {
    walk(dir);
  } catch (error) {
    if (error?.code !== 'ENOENT') throw error;
  }
  return assets;
}

/** Answers from assets when the path is one of them; false when the request is not for an asset. */
export function serveAsset(assets, req, res) {
  if (req.method !== 'GET' && req.method !== 'HEAD') return false;
  const q = req.url.indexOf('?');
  let path = q === -1 ? req.url : req.url.slice(0, q);
  if (path.includes('%')) {
    try {
      path = decodeURIComponent(path);
    } catch {
      return false;
    }
  }
  const asset = assets.get(path);
  if (!asset) return false;
  if (req.headers['if-none-match'] === asset.etag) {
    res.writeHead(304, { etag: asset.etag, 'cache-control': asset.headers['cache-control'] });
    res.end();
    return true;
  }
  res.writeHead(200, asset.headers);
  res.end(req.method === 'HEAD' ? undefined : asset.body);
  return true;
}
