// How big the offline pack gets (issue 16: "bounded"): for the demo team, and for a team with 5,000 records.
// Prints the sizes (raw JSON and gzip, as the browser fetches it) and keeps them under fixed ceilings.
import { describe, it, expect, beforeAll } from 'vitest';
import { gzipSync } from 'node:zlib';
import { call } from '../setup/http';
import { seedDemo, sessionsForAllRoles, type DemoRole } from '../setup/db';
import * as pack from '../../src/pages/api/offline/pack';
import { count } from 'drizzle-orm';
import { db } from '../../src/lib/server/db/client';
import { records, seasons, subsystems } from '../../src/lib/server/db/schema';
import { templateFor } from '../../src/lib/editor/templates';

let s: Record<DemoRole, string>;
beforeAll(async () => {
  await seedDemo();
  s = await sessionsForAllRoles();
});

async function size(role: DemoRole, since?: string) {
  const res = await call(pack, 'GET', { session: s[role], query: since ? { since } : {} });
  expect(res.status).toBe(200);
  return { bytes: res.bytes.length, gzip: gzipSync(res.bytes).length, body: res.body };
}

const kb = (n: number) => `${(n / 1024).toFixed(1)} kB`;
const line = (what: string, x: { bytes: number; gzip: number; body: { records: unknown[] } }) =>
  console.log(`offline pack, ${what}: ${x.body.records.length} records, ${kb(x.bytes)} JSON, ${kb(x.gzip)} gzip`);

describe('offline pack size', () => {
  it('stays small for the demo team and bounded for a team with 5,000 records', async () => {
    const demoMember = await size('member');
    const demoLead = await size('lead');
    line('demo team, member', demoMember);
    line('demo team, lead', demoLead);
    expect(demoMember.bytes).toBeLessThan(64 * 1024);

    // 5,000 records spread over every subsystem and season, titles of a realistic length.
    const subs = db().select({ slug: subsystems.slug }).from(subsystems).all();
    const seas = db().select({ id: seasons.id }).from(seasons).all();
    const countRecords = () => db().select({ n: count() }).from(records).get()!.n;
    const existing = countRecords();
    const body = templateFor('lesson');
    const now = Date.now();
    db().transaction((tx) => {
      for (let i = existing; i < 5000; i++) {
        tx.insert(records)
          .values({
            id: `bulk-${String(i).padStart(5, '0')}`,
            kind: i % 3 ? 'lesson' : 'decision',
            title: `Bulk record ${i}: what we measured on the test day and what we changed afterwards`,
            subsystemSlug: subs[i % subs.length].slug,
            seasonId: seas[i % seas.length].id,
            status: i % 3 ? 'addressed' : 'accepted',
            source: i % 3 ? 'testing' : null,
            body,
            createdAt: new Date(now - i * 60_000),
            updatedAt: new Date(now - i * 60_000),
          })
          .run();
      }
    });
    expect(countRecords()).toBe(5000);

    const bigMember = await size('member');
    const bigLead = await size('lead');
    line('5,000 records, member (2 subsystems)', bigMember);
    line('5,000 records, lead (every subsystem)', bigLead);
    expect(bigLead.body.records).toHaveLength(5000);
    expect(bigLead.bytes).toBeLessThan(2 * 1024 * 1024);
    expect(bigLead.gzip).toBeLessThan(256 * 1024);

    // Fetched again later, only what changed comes back.
    const next = await size('lead', bigLead.body.version);
    line('5,000 records, lead, nothing changed since', next);
    expect(next.bytes).toBeLessThan(16 * 1024);
  });
});
