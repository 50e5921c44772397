import { and, desc, eq, gte, inArray, isNull, ne, notInArray, or } from 'drizzle-orm';
import { alias } from 'drizzle-orm/sqlite-core';
import type { RecordKind } from '../../domain';
import { db } from '../db/client';
import {
  calculations,
  comments,
  onboardingItems,
  onboardingProgress,
  records,
  seasons,
  subsystems,
  users,
} from '../db/schema';
import { currentSeason } from '../seasons';
import { subsystemsOf } from '../memberships';
import { listGuides } from '../guides';
import type { EmailSection } from '../mail/layout';

/** At most this many lines per section; the e-mail points to the app for the rest. */
const LIMIT = 15;

export interface Digest {
  sections: EmailSection[];
  counts: { decisions: number; lessons: number; comments: number; onboarding: number };
}

function newRecords(kind: RecordKind, since: Date, base: string) {
  return db()
    .select({
      id: records.id,
      title: records.title,
      status: records.status,
      subsystem: subsystems.name,
      season: seasons.name,
    })
    .from(records)
    .innerJoin(subsystems, eq(subsystems.slug, records.subsystemSlug))
    .innerJoin(seasons, eq(seasons.id, records.seasonId))
    .where(and(eq(records.kind, kind), gte(records.createdAt, since), isNull(records.deletedAt)))
    .orderBy(desc(records.createdAt))
    .limit(LIMIT)
    .all()
    .map((r) => ({ title: r.title, url: `${base}/records/${r.id}`, note: `${r.subsystem}, ${r.season}, ${r.status}` }));
}

const commenter = alias(users, 'commenter');

/** Questions and answers others left on records this person wrote. */
function commentsOnTheirRecords(userId: string, since: Date, base: string) {
  return db()
    .select({ recordId: records.id, title: records.title, author: commenter.name, body: comments.body })
    .from(comments)
    .innerJoin(records, eq(records.id, comments.recordId))
    .leftJoin(commenter, eq(commenter.id, comments.authorId))
    .where(
      and(
        eq(records.authorId, userId),
        or(isNull(comments.authorId), ne(comments.authorId, userId)),
        gte(comments.createdAt, since),
        isNull(records.deletedAt),
      ),
    )
    .orderBy(desc(comments.createdAt))
    .limit(LIMIT)
    .all()
    .map((c) => ({
      title: `${c.author ?? 'A former member'} on “${c.title}”`,
      url: `${base}/records/${c.recordId}`,
      note: c.body.length > 120 ? `${c.body.slice(0, 117)}…` : c.body,
    }));
}

/** Onboarding steps not yet done in the subsystems this person owns this season. */
async function unfinishedOnboarding(userId: string, base: string) {
  const season = currentSeason();
  if (!season) return [];
  const owned = subsystemsOf(userId, season.id).map((s) => s.slug);
  if (owned.length === 0) return [];
  const done = db()
    .select({ id: onboardingProgress.itemId })
    .from(onboardingProgress)
    .where(eq(onboardingProgress.userId, userId))
    .all()
    .map((d) => d.id);
  const items = db()
    .select({
      id: onboardingItems.id,
      kind: onboardingItems.kind,
      ref: onboardingItems.ref,
      subsystem: subsystems.name,
      slug: subsystems.slug,
    })
    .from(onboardingItems)
    .innerJoin(subsystems, eq(subsystems.slug, onboardingItems.subsystemSlug))
    .where(
      and(
        inArray(onboardingItems.subsystemSlug, owned),
        done.length ? notInArray(onboardingItems.id, done) : undefined,
      ),
    )
    .orderBy(onboardingItems.subsystemSlug, onboardingItems.position)
    .limit(LIMIT)
    .all();
  if (items.length === 0) return [];
  const guideTitles = items.some((i) => i.kind === 'guide')
    ? new Map((await listGuides()).map((g) => [g.slug, g.title]))
    : new Map<string, string>();
  const ids = (kind: string) => items.filter((i) => i.kind === kind).map((i) => i.ref);
  const recordTitles = new Map(
    ids('record').length
      ? db()
          .select({ id: records.id, title: records.title })
          .from(records)
          .where(and(inArray(records.id, ids('record')), isNull(records.deletedAt)))
          .all()
          .map((r) => [r.id, r.title])
      : [],
  );
  const calcTitles = new Map(
    ids('calculation').length
      ? db()
          .select({ id: calculations.id, title: calculations.title })
          .from(calculations)
          .where(and(inArray(calculations.id, ids('calculation')), isNull(calculations.deletedAt)))
          .all()
          .map((c) => [c.id, c.title])
      : [],
  );
  // A step pointing at a deleted record or calculation is not worth a line (nor its title a mention).
  const live = items.filter(
    (i) => (i.kind !== 'record' || recordTitles.has(i.ref)) && (i.kind !== 'calculation' || calcTitles.has(i.ref)),
  );
  return live.map((i) => {
    const title =
      (i.kind === 'guide' ? guideTitles : i.kind === 'record' ? recordTitles : calcTitles).get(i.ref) ?? i.ref;
    const path =
      i.kind === 'guide' ? `/guides/${i.ref}` : i.kind === 'record' ? `/records/${i.ref}` : `/calculations/${i.ref}`;
    return { title, url: `${base}${path}`, note: `${i.subsystem} onboarding, ${i.kind}` };
  });
}

export async function buildDigest(userId: string, since: Date, base: string): Promise<Digest> {
  const decisions = newRecords('decision', since, base);
  const lessons = newRecords('lesson', since, base);
  const qa = commentsOnTheirRecords(userId, since, base);
  const onboarding = await unfinishedOnboarding(userId, base);
  const sections: EmailSection[] = [
    { heading: 'New decision records', items: decisions },
    { heading: 'New lessons', items: lessons },
    { heading: 'Questions and answers on your records', items: qa },
    { heading: 'Your unfinished onboarding steps', items: onboarding },
  ].filter((s) => s.items.length > 0);
  return {
    sections,
    counts: {
      decisions: decisions.length,
      lessons: lessons.length,
      comments: qa.length,
      onboarding: onboarding.length,
    },
  };
}
