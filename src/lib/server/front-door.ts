// The first code a request meets after the static assets (integrations/server-entry.mjs calls it through
// globalThis.__wakebookFrontDoor): it validates the session once, answers a repeated signed-in read straight
// from the response cache, and hands everything else to Astro with the session it already checked.
import type { IncomingMessage, ServerResponse } from 'node:http';
import { checkSessionCookie, type SessionCheck } from './auth/lucia';
import { cachedEntry } from './response-cache';

type AstroHandler = (
  req: IncomingMessage,
  res: ServerResponse,
  next?: undefined,
  locals?: Partial<App.Locals>,
) => Promise<void>;

export async function frontDoor(req: IncomingMessage, res: ServerResponse, astro: AstroHandler): Promise<void> {
  let check: SessionCheck;
  try {
    check = await checkSessionCookie(req.headers.cookie);
  } catch {
    // Let Astro's own error handling answer (it validates again and reports the failure).
    return astro(req, res);
  }
  // A session Lucia just extended needs a fresh cookie, which only Astro's path sets.
  if (req.method === 'GET' && check.user && check.session && !check.session.fresh && req.url) {
    const hit = cachedEntry(`${check.user.id}\u0000${req.url}`);
    if (hit) {
      res.writeHead(hit.status, hit.raw);
      res.end(hit.body);
      return;
    }
  }
  return astro(req, res, undefined, { sessionCheck: check });
}
