import type { APIRoute } from 'astro';
import { json } from '~/lib/server/http';
import { db } from '~/lib/server/db/client';

export const GET: APIRoute = () => {
  try {
    db().$client.prepare('select 1').get();
    return json({ ok: true });
  } catch {
    return json({ ok: false }, 503);
  }
};
