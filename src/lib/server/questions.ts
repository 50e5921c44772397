// Questions and notes on records, answers to questions, and who is told. The archive exists so that last season's
// people answer this season's questions: a new question e-mails the record's author and everyone who owned the
// record's subsystem in an earlier season (alumni included); an answer e-mails the asker. Each person can turn
// either e-mail off (users.notifyQuestions / users.notifyAnswers).
import { and, asc, desc, eq, inArray, isNotNull, isNull, lt, ne, sql } from 'drizzle-orm';
import { alias } from 'drizzle-orm/sqlite-core';
import { db, prepared } from './db/client';
import { comments, membershipSubsystems, records, seasonMemberships, seasons, subsystems, users } from './db/schema';
import { HttpError, conflict, invalidInput, notFound } from './http';
import { newId } from './ids';
import { recordAudit } from './audit';
import { currentSeason } from './seasons';
import { sendMail } from './mail/send';
import { answerEmail, questionEmail, type QuestionReason } from './mail/messages';
import { can } from '../policy';
import type { CommentKind, Role } from '../domain';
import type { CommentInput, QuestionState } from '../schemas/records';

type Actor = { id: string; email: string; name: string; role: Role };

const asker = alias(users, 'asker');
const settler = alias(users, 'settler');

export interface CommentView {
  id: string;
  recordId: string;
  kind: CommentKind;
  body: string;
  replyTo: string | null;
  /** The same as replyTo, under the name the first API used. */
  parentId: string | null;
  createdAt: string;
  authorId: string | null;
  author: string;
  authorRole: Role | null;
  answeredAt: string | null;
  answeredBy: string | null;
}

function commentQuery() {
  return db()
    .select({
      id: comments.id,
      recordId: comments.recordId,
      kind: comments.kind,
      body: comments.body,
      parentId: comments.parentId,
      createdAt: comments.createdAt,
      authorId: comments.authorId,
      author: asker.name,
      authorRole: asker.role,
      answeredAt: comments.answeredAt,
      answeredBy: settler.name,
    })
    .from(comments)
    .leftJoin(asker, eq(asker.id, comments.authorId))
    .leftJoin(settler, eq(settler.id, comments.answeredById));
}

type CommentRow = Awaited<ReturnType<ReturnType<typeof commentQuery>['all']>>[number];

function toView(c: CommentRow): CommentView {
  return {
    id: c.id,
    recordId: c.recordId,
    kind: c.kind,
    body: c.body,
    replyTo: c.parentId,
    parentId: c.parentId,
    createdAt: c.createdAt.toISOString(),
    authorId: c.authorId,
    author: c.author ?? 'former member',
    authorRole: c.authorRole,
    answeredAt: c.answeredAt?.toISOString() ?? null,
    answeredBy: c.answeredAt ? (c.answeredBy ?? 'former member') : null,
  };
}

/** Every comment on a record, oldest first (answers follow their question in the islands). */
export function listComments(recordId: string): CommentView[] {
  // Prepared once: every record page reads these, and building the joined SQL cost more than running it.
  return prepared('listComments', () =>
    commentQuery()
      .where(eq(comments.recordId, sql.placeholder('recordId')))
      .orderBy(asc(comments.createdAt), asc(comments.id))
      .prepare(),
  )
    .all({ recordId })
    .map(toView);
}

function findComment(id: string): CommentView | null {
  const c = commentQuery().where(eq(comments.id, id)).get();
  return c ? toView(c) : null;
}

/** The live (not deleted) record a comment may be written on, with what the e-mails need. */
function liveRecord(id: string) {
  return (
    db()
      .select({
        id: records.id,
        title: records.title,
        authorId: records.authorId,
        subsystem: records.subsystemSlug,
        subsystemName: subsystems.name,
      })
      .from(records)
      .innerJoin(subsystems, eq(subsystems.slug, records.subsystemSlug))
      .where(and(eq(records.id, id), isNull(records.deletedAt)))
      .get() ?? null
  );
}

/**
 * The people who owned a subsystem in a season before the current one (every season when none is current),
 * whatever their role today: alumni are the point.
 */
function earlierOwners(subsystem: string): string[] {
  const current = currentSeason();
  return db()
    .selectDistinct({ id: seasonMemberships.userId })
    .from(seasonMemberships)
    .innerJoin(membershipSubsystems, eq(membershipSubsystems.membershipId, seasonMemberships.id))
    .innerJoin(seasons, eq(seasons.id, seasonMemberships.seasonId))
    .where(
      and(
        eq(membershipSubsystems.subsystemSlug, subsystem),
        current ? lt(seasons.startsOn, current.startsOn) : undefined,
      ),
    )
    .all()
    .map((r) => r.id);
}

/** Who a new question on this record is sent to, and why; never the asker, each person once. */
export function questionRecipients(
  record: { authorId: string | null; subsystem: string },
  askerId: string,
): { id: string; reason: QuestionReason }[] {
  const out = new Map<string, QuestionReason>();
  if (record.authorId) out.set(record.authorId, 'author');
  for (const id of earlierOwners(record.subsystem)) if (!out.has(id)) out.set(id, 'earlier-owner');
  out.delete(askerId);
  return [...out].map(([id, reason]) => ({ id, reason }));
}

function people(ids: string[]) {
  if (ids.length === 0) return new Map<string, typeof users.$inferSelect>();
  return new Map(
    db()
      .select()
      .from(users)
      .where(inArray(users.id, ids))
      .all()
      .map((u) => [u.id, u]),
  );
}

/** Writes a question, a note or an answer, then sends the e-mails it causes (mail never fails the write). */
export async function addComment(
  recordId: string,
  input: CommentInput,
  actor: Actor,
  base: string,
): Promise<CommentView> {
  const record = liveRecord(recordId);
  if (!record) throw notFound('That record');
  let question: CommentView | null = null;
  if (input.replyTo) {
    const parent = findComment(input.replyTo);
    if (!parent || parent.recordId !== recordId)
      throw invalidInput([{ path: 'replyTo', message: 'That comment is not on this record.' }]);
    if (input.kind === 'question')
      throw invalidInput([{ path: 'kind', message: 'A reply is an answer or a note; ask a new question on its own.' }]);
    // Replies hang under the first comment of a thread, so a thread stays one level deep.
    question = parent.replyTo ? findComment(parent.replyTo) : parent;
  }
  const kind: CommentKind = input.replyTo ? 'note' : (input.kind ?? 'note');
  const id = newId();
  db()
    .insert(comments)
    .values({
      id,
      recordId,
      authorId: actor.id,
      parentId: question?.id ?? null,
      kind,
      body: input.body,
      createdAt: new Date(),
    })
    .run();
  recordAudit({
    actor,
    action: kind === 'question' ? 'record.question' : 'record.comment',
    targetType: 'record',
    targetId: recordId,
    detail: { comment: id, ...(question ? { replyTo: question.id } : {}) },
  });
  const url = `${base}/records/${recordId}#comment-${question?.id ?? id}`;
  const accountUrl = `${base}/account`;
  if (kind === 'question') {
    const recipients = questionRecipients(record, actor.id);
    const who = people(recipients.map((r) => r.id));
    await Promise.all(
      recipients.flatMap(({ id: uid, reason }) => {
        const u = who.get(uid);
        if (!u?.notifyQuestions) return [];
        return sendMail(
          u.email,
          questionEmail({
            name: u.name,
            askerName: actor.name,
            recordTitle: record.title,
            subsystemName: record.subsystemName,
            body: input.body,
            reason,
            url,
            accountUrl,
          }),
        );
      }),
    );
  } else if (question?.kind === 'question' && question.authorId && question.authorId !== actor.id) {
    const u = people([question.authorId]).get(question.authorId);
    if (u?.notifyAnswers) {
      await sendMail(
        u.email,
        answerEmail({
          name: u.name,
          answererName: actor.name,
          recordTitle: record.title,
          question: question.body,
          body: input.body,
          url,
          accountUrl,
        }),
      );
    }
  }
  return findComment(id)!;
}

/** Marks a question answered: its asker, the record's author, an advisor or a lead. Marking twice is harmless. */
export function markAnswered(commentId: string, actor: Actor): CommentView {
  const c = findComment(commentId);
  const record = c && liveRecord(c.recordId);
  if (!c || !record) throw notFound('That question');
  const isOwn = c.authorId === actor.id || record.authorId === actor.id;
  if (!can(actor, 'question:mark-answered', { isOwn }))
    throw new HttpError(403, 'forbidden', 'Only the asker, the record’s author, an advisor or a lead can settle this.');
  if (c.kind !== 'question') throw conflict('Only a question can be marked answered.');
  if (c.answeredAt) return c;
  db()
    .update(comments)
    .set({ answeredAt: new Date(), answeredById: actor.id })
    .where(and(eq(comments.id, commentId), isNull(comments.answeredAt)))
    .run();
  recordAudit({
    actor,
    action: 'record.question-answered',
    targetType: 'record',
    targetId: c.recordId,
    detail: { comment: c.id },
  });
  return findComment(commentId)!;
}

export interface QuestionView {
  id: string;
  recordId: string;
  recordTitle: string;
  subsystem: string;
  subsystemName: string;
  askedBy: string;
  askedAt: string;
  body: string;
  answers: number;
  answeredAt: string | null;
  url: string;
}

function questionQuery() {
  return db()
    .select({
      id: comments.id,
      recordId: records.id,
      recordTitle: records.title,
      recordAuthorId: records.authorId,
      subsystem: records.subsystemSlug,
      subsystemName: subsystems.name,
      askedBy: asker.name,
      askedAt: comments.createdAt,
      body: comments.body,
      answers: sql<number>`(select count(*) from ${comments} as "answer" where "answer"."parent_id" = ${comments.id})`,
      answeredAt: comments.answeredAt,
      position: subsystems.position,
    })
    .from(comments)
    .innerJoin(records, eq(records.id, comments.recordId))
    .innerJoin(subsystems, eq(subsystems.slug, records.subsystemSlug))
    .leftJoin(asker, eq(asker.id, comments.authorId));
}

function toQuestion(q: Awaited<ReturnType<ReturnType<typeof questionQuery>['all']>>[number]): QuestionView {
  return {
    id: q.id,
    recordId: q.recordId,
    recordTitle: q.recordTitle,
    subsystem: q.subsystem,
    subsystemName: q.subsystemName,
    askedBy: q.askedBy ?? 'former member',
    askedAt: q.askedAt.toISOString(),
    body: q.body,
    answers: q.answers,
    answeredAt: q.answeredAt?.toISOString() ?? null,
    url: `/records/${q.recordId}#comment-${q.id}`,
  };
}

/** Questions on live records, by subsystem (the team's order), newest first within one. */
export function listQuestions(filter: { state?: QuestionState; subsystem?: string } = {}): QuestionView[] {
  return questionQuery()
    .where(
      and(
        eq(comments.kind, 'question'),
        isNull(records.deletedAt),
        filter.state === 'open' ? isNull(comments.answeredAt) : undefined,
        filter.state === 'answered' ? isNotNull(comments.answeredAt) : undefined,
        filter.subsystem ? eq(records.subsystemSlug, filter.subsystem) : undefined,
      ),
    )
    .orderBy(asc(subsystems.position), desc(comments.createdAt))
    .all()
    .map(toQuestion);
}

/**
 * Open questions this person is asked to answer: on records they wrote, or on subsystems they owned in an earlier
 * season. Never their own questions.
 */
export function questionsWaitingFor(userId: string): (QuestionView & { reason: QuestionReason })[] {
  // Both statements are prepared once (every home page asks): the subsystems come in as a JSON array, and "before
  // the current season" is a date bound that every season passes when none is current.
  const before = currentSeason()?.startsOn ?? '9999-12-31';
  const owned = prepared('questionsWaitingFor.owned', (d) =>
    d
      .selectDistinct({ slug: membershipSubsystems.subsystemSlug })
      .from(seasonMemberships)
      .innerJoin(membershipSubsystems, eq(membershipSubsystems.membershipId, seasonMemberships.id))
      .innerJoin(seasons, eq(seasons.id, seasonMemberships.seasonId))
      .where(
        and(eq(seasonMemberships.userId, sql.placeholder('userId')), lt(seasons.startsOn, sql.placeholder('before'))),
      )
      .prepare(),
  )
    .all({ userId, before })
    .map((r) => r.slug);
  const rows = prepared('questionsWaitingFor.rows', () =>
    questionQuery()
      .where(
        and(
          eq(comments.kind, 'question'),
          isNull(records.deletedAt),
          isNull(comments.answeredAt),
          ne(sql`coalesce(${comments.authorId}, '')`, sql.placeholder('userId')),
          sql`(${records.authorId} = ${sql.placeholder('userId')} or ${records.subsystemSlug} in (select value from json_each(${sql.placeholder('owned')})))`,
        ),
      )
      .orderBy(desc(comments.createdAt))
      .prepare(),
  ).all({ userId, owned: JSON.stringify(owned) });
  return rows.map((q) => ({ ...toQuestion(q), reason: q.recordAuthorId === userId ? 'author' : 'earlier-owner' }));
}
