// A deleted (soft-deleted) record or calculation leaves every read path: its title and link must not show anywhere.
import { describe, it, expect, beforeAll } from 'vitest';
import { eq, inArray } from 'drizzle-orm';
import { seedDemo } from '../setup/db';
import { db } from '../../src/lib/server/db/client';
import { calculations, onboardingItems, recordCalculations, records, users } from '../../src/lib/server/db/schema';
import { subsystemTimeline } from '../../src/lib/server/records/timeline';
import { readinessFor } from '../../src/lib/server/readiness';
import { buildDigest } from '../../src/lib/server/digest/build';
import { newId } from '../../src/lib/server/ids';
import { demoAccounts } from '../setup/db';

beforeAll(seedDemo);

const OLD_PROPELLER = 'demo-rec-2425-single-propeller';

function deleteRecord(id: string) {
  db().update(records).set({ deletedAt: new Date() }).where(eq(records.id, id)).run();
}

describe('the subsystem timeline', () => {
  it('leaves out a deleted record that a live decision superseded: no title, no link', () => {
    const title = db().select().from(records).where(eq(records.id, OLD_PROPELLER)).get()!.title;
    const before = JSON.stringify(subsystemTimeline('propulsion', 'decision'));
    expect(before).toContain(OLD_PROPELLER);
    deleteRecord(OLD_PROPELLER);
    const after = JSON.stringify(subsystemTimeline('propulsion', 'decision'));
    expect(after).not.toContain(OLD_PROPELLER);
    expect(after).not.toContain(title);
  });
});

describe('readiness', () => {
  it('does not count a deleted calculation as the reasoning behind an accepted decision', async () => {
    const decisionsCheck = async () =>
      (await readinessFor()).subsystems.flatMap((x) => x.checks.filter((c) => c.key === 'decisions'));
    const before = await decisionsCheck();
    const linked = db()
      .select({ calculationId: recordCalculations.calculationId, title: records.title })
      .from(recordCalculations)
      .innerJoin(records, eq(records.id, recordCalculations.recordId))
      .where(eq(records.status, 'accepted'))
      .all();
    expect(linked.length).toBeGreaterThan(0);
    db()
      .update(calculations)
      .set({ deletedAt: new Date() })
      .where(
        inArray(
          calculations.id,
          linked.map((l) => l.calculationId),
        ),
      )
      .run();
    const after = await decisionsCheck();
    const needsCalc = (checks: typeof before) =>
      checks.flatMap((c) => c.missing).filter((m) => m.includes('a linked calculation')).length;
    expect(needsCalc(after)).toBeGreaterThan(needsCalc(before));
  });
});

describe('the digest', () => {
  it("leaves out an onboarding step whose record was deleted, and the record's title with it", async () => {
    const memberId = db().select().from(users).where(eq(users.email, demoAccounts.member)).get()!.id;
    const target = 'demo-rec-2526-closed-cooling-loop';
    db()
      .insert(onboardingItems)
      .values({
        id: newId(),
        subsystemSlug: 'cooling',
        position: 98,
        kind: 'record',
        ref: target,
        createdAt: new Date(),
      })
      .onConflictDoNothing()
      .run();
    const since = new Date(Date.now() - 7 * 24 * 3600 * 1000);
    const before = JSON.stringify(await buildDigest(memberId, since, 'https://wakebook.example'));
    expect(before).toContain(`/records/${target}`);
    deleteRecord(target);
    const after = JSON.stringify(await buildDigest(memberId, since, 'https://wakebook.example'));
    expect(after).not.toContain(target);
  });
});
