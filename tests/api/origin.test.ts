// API.md: a state-changing request whose Origin is present and not this site's is refused with 403, whatever its
// content type. Astro's own origin check covers form posts only; a cross-site JSON write used to be accepted.
import { describe, it, expect, beforeAll } from 'vitest';
import { call } from '../setup/http';
import { seedDemo, sessionFor } from '../setup/db';
import * as commentsRoute from '../../src/pages/api/records/[id]/comments';
import * as records from '../../src/pages/api/records/index';

const ID = 'demo-rec-2526-two-propellers';
let member: string;

beforeAll(async () => {
  await seedDemo();
  member = await sessionFor('member');
});

describe('cross-origin writes', () => {
  it('a JSON comment posted from another site is refused with 403 and nothing is stored', async () => {
    const before = await call(commentsRoute, 'GET', { session: member, params: { id: ID } });
    const res = await call(commentsRoute, 'POST', {
      session: member,
      params: { id: ID },
      body: { body: 'Sent from elsewhere' },
      headers: { origin: 'https://elsewhere.example' },
    });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('forbidden');
    const after = await call(commentsRoute, 'GET', { session: member, params: { id: ID } });
    expect(after.body.comments.length).toBe(before.body.comments.length);
  });

  it('every state-changing verb is checked, GET is not', async () => {
    const foreign = { origin: 'http://localhost:9999' };
    for (const method of ['POST'] as const) {
      const res = await call(records, method, { session: member, body: {}, headers: foreign });
      expect(res.status).toBe(403);
    }
    const read = await call(records, 'GET', { session: member, headers: foreign });
    expect(read.status).toBe(200);
  });

  it('our own origin, and a request without Origin (not a browser cross-site request), go through', async () => {
    const same = await call(commentsRoute, 'POST', {
      session: member,
      params: { id: ID },
      body: { body: 'From the app itself' },
      headers: { origin: 'http://localhost:4321' },
    });
    expect(same.status).toBe(201);
    const none = await call(commentsRoute, 'POST', { session: member, params: { id: ID }, body: { body: 'A script' } });
    expect(none.status).toBe(201);
  });
});
