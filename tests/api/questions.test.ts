// Questions that reach the people who know: kinds, answers, who may mark a question answered, who is e-mailed, the
// opt-outs, GET /api/questions and the home page's "waiting for you".
import { describe, it, expect, beforeAll } from 'vitest';
import { eq } from 'drizzle-orm';
import { call } from '../setup/http';
import { seedDemo, sessionsForAllRoles, demoAccounts, type DemoRole } from '../setup/db';
import { latestMailTo, linkIn, mailCountTo } from '../setup/mail';
import * as commentsRoute from '../../src/pages/api/records/[id]/comments';
import * as answered from '../../src/pages/api/comments/[id]/answered';
import * as questionsRoute from '../../src/pages/api/questions';
import * as recordsRoute from '../../src/pages/api/records/index';
import * as me from '../../src/pages/api/me';
import { db } from '../../src/lib/server/db/client';
import { records, users } from '../../src/lib/server/db/schema';
import { listOutbox } from '../../src/lib/server/mail/outbox';
import { questionsWaitingFor } from '../../src/lib/server/questions';

let s: Record<DemoRole, string>;
const userId = (email: string) => db().select().from(users).where(eq(users.email, email)).get()!.id;
const doc = (text: string) => ({ type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text }] }] });

// Propulsion was owned by Priya Raman (alumni@) in 2023–24 and 2024–25 and is owned by the member this season.
const PROPULSION_2526 = 'demo-rec-2526-two-propellers'; // written by the member
const COOLING_2425 = 'demo-rec-2425-water-cooling-loop'; // written by Amara Nwosu, who owned cooling until 2024–25

async function ask(role: DemoRole, recordId: string, body: string, extra: Record<string, unknown> = {}) {
  return call(commentsRoute, 'POST', { session: s[role], params: { id: recordId }, body: { body, ...extra } });
}

beforeAll(async () => {
  await seedDemo();
  s = await sessionsForAllRoles();
});

describe('POST /api/records/{id}/comments', () => {
  it('stores a question with its kind; an answer is a reply to it', async () => {
    const q = await ask('member', COOLING_2425, 'Which hose clamps held up best in the lake water?', {
      kind: 'question',
    });
    expect(q.status).toBe(201);
    expect(q.body.comment).toMatchObject({ kind: 'question', replyTo: null, answeredAt: null });
    const a = await ask('alumni', COOLING_2425, 'Stainless worm-drive clamps, doubled on the pump side.', {
      replyTo: q.body.comment.id,
    });
    expect(a.status).toBe(201);
    expect(a.body.comment).toMatchObject({ kind: 'note', replyTo: q.body.comment.id });
    const list = await call(commentsRoute, 'GET', { session: s.advisor, params: { id: COOLING_2425 } });
    const mine = list.body.comments.filter((c: { id: string }) =>
      [q.body.comment.id, a.body.comment.id].includes(c.id),
    );
    expect(mine.map((c: { kind: string }) => c.kind)).toEqual(['question', 'note']);
  });

  it('a comment without a kind is a note; a reply cannot be a question; replies stay one level deep', async () => {
    const note = await ask('advisor', COOLING_2425, 'The pump datasheet is in the team drive.');
    expect(note.body.comment.kind).toBe('note');
    const bad = await ask('member', COOLING_2425, 'And what about this?', {
      kind: 'question',
      replyTo: note.body.comment.id,
    });
    expect(bad.status).toBe(400);
    expect(bad.body.error.issues[0].path).toBe('kind');
    const reply = await ask('member', COOLING_2425, 'Thanks.', { replyTo: note.body.comment.id });
    const replyToReply = await ask('lead', COOLING_2425, 'Found it too.', { replyTo: reply.body.comment.id });
    expect(replyToReply.body.comment.replyTo).toBe(note.body.comment.id);
  });

  it('refuses an unknown kind, a reply to a comment on another record, and a missing record', async () => {
    expect((await ask('member', COOLING_2425, 'Hello there', { kind: 'answer' })).status).toBe(400);
    const other = await ask('member', PROPULSION_2526, 'A note elsewhere.');
    const cross = await ask('member', COOLING_2425, 'Reply across', { replyTo: other.body.comment.id });
    expect(cross.status).toBe(400);
    expect(cross.body.error.issues[0].path).toBe('replyTo');
    expect((await ask('member', 'nope', 'Anyone?')).status).toBe(404);
    expect((await call(commentsRoute, 'POST', { params: { id: COOLING_2425 }, body: { body: 'x' } })).status).toBe(401);
  });

  it('still accepts parentId, the first name of replyTo', async () => {
    const q = await ask('member', COOLING_2425, 'Was the scoop ever blocked by ice in spring?', { kind: 'question' });
    const a = await ask('alumni', COOLING_2425, 'Never; we launched from May.', { parentId: q.body.comment.id });
    expect(a.body.comment.replyTo).toBe(q.body.comment.id);
  });
});

describe('who is e-mailed', () => {
  it('a new question goes to the record’s author and the subsystem’s earlier owners, alumni included, never the asker', async () => {
    const before = listOutbox().length;
    const q = await ask('member', COOLING_2425, 'Did the strut scoop ever suck in air at speed?', {
      kind: 'question',
    });
    expect(q.status).toBe(201);
    const sent = listOutbox().slice(0, listOutbox().length - before);
    // Cooling: Amara Nwosu (author; owner 2023–24 and 2024–25). The member asking owns cooling this season only.
    expect(sent.map((m) => m.to).sort()).toEqual(['amara.nwosu@wakebook.test']);
    const mail = latestMailTo('amara.nwosu@wakebook.test');
    expect(mail.subject).toContain('Cool the controller with lake water');
    expect(mail.text).toContain('Did the strut scoop ever suck in air at speed?');
    expect(linkIn(mail.text)).toContain(`/records/${COOLING_2425}#comment-${q.body.comment.id}`);
  });

  it('a question on this season’s record reaches earlier owners: on propulsion, Priya (alumni) and the author', async () => {
    const before = listOutbox().length;
    await ask('advisor', PROPULSION_2526, 'Is the castle nut secured with a split pin or thread locker?', {
      kind: 'question',
    });
    const sent = listOutbox().slice(0, listOutbox().length - before);
    expect(sent.map((m) => m.to).sort()).toEqual([demoAccounts.alumni, demoAccounts.member].sort());
    expect(latestMailTo(demoAccounts.alumni).text).toContain('in an earlier season');
    expect(latestMailTo(demoAccounts.member).text).toContain('You wrote');
  });

  it('a note e-mails nobody; an answer e-mails the asker only, and not when they answer themselves', async () => {
    const before = listOutbox().length;
    await ask('member', PROPULSION_2526, 'Bollard pull repeated with a new battery: same numbers.');
    expect(listOutbox().length).toBe(before);
    const q = await ask('lead', PROPULSION_2526, 'Who keeps the spare propeller nut?', { kind: 'question' });
    const afterQ = listOutbox().length;
    await ask('alumni', PROPULSION_2526, 'It lived in the red box in 2025.', { replyTo: q.body.comment.id });
    const sent = listOutbox().slice(0, listOutbox().length - afterQ);
    expect(sent.map((m) => m.to)).toEqual([demoAccounts.lead]);
    expect(sent[0].subject).toContain('Priya Raman answered your question');
    expect(sent[0].text).toContain('It lived in the red box in 2025.');
    const own = listOutbox().length;
    await ask('lead', PROPULSION_2526, 'Found it, thanks.', { replyTo: q.body.comment.id });
    expect(listOutbox().length).toBe(own);
  });

  it('each person can turn off question and answer e-mails on their account', async () => {
    const off = await call(me, 'PATCH', { session: s.alumni, body: { notifyQuestions: false } });
    expect(off.status).toBe(200);
    expect(off.body).toMatchObject({ notifyQuestions: false, notifyAnswers: true });
    const alumniMail = mailCountTo(demoAccounts.alumni);
    await ask('lead', PROPULSION_2526, 'Should the sprint prop get a new pitch gauge check?', { kind: 'question' });
    expect(mailCountTo(demoAccounts.alumni)).toBe(alumniMail);

    expect((await call(me, 'PATCH', { session: s.advisor, body: { notifyAnswers: false } })).status).toBe(200);
    const q = await ask('advisor', PROPULSION_2526, 'Is the shaft runout logged anywhere?', { kind: 'question' });
    const advisorMail = mailCountTo(demoAccounts.advisor);
    await ask('member', PROPULSION_2526, 'In the bollard pull sheet.', { replyTo: q.body.comment.id });
    expect(mailCountTo(demoAccounts.advisor)).toBe(advisorMail);

    const back = await call(me, 'PATCH', { session: s.alumni, body: { notifyQuestions: true } });
    expect(back.body.notifyQuestions).toBe(true);
    expect(db().select().from(users).where(eq(users.email, demoAccounts.alumni)).get()!.notifyQuestions).toBe(true);
  });

  it('PATCH /api/me refuses a body with no choice or a non-boolean, and keeps the digest answer', async () => {
    expect((await call(me, 'PATCH', { session: s.member, body: {} })).status).toBe(400);
    expect((await call(me, 'PATCH', { session: s.member, body: { notifyAnswers: 'no' } })).status).toBe(400);
    const ok = await call(me, 'PATCH', { session: s.member, body: { notifyAnswers: true } });
    expect(ok.body).toHaveProperty('digestOptIn');
  });
});

describe('POST /api/comments/{id}/answered', () => {
  async function question(by: DemoRole) {
    const q = await ask(by, COOLING_2425, `A question from the ${by} about the pump?`, { kind: 'question' });
    return q.body.comment.id as string;
  }

  it('the asker may mark their question answered', async () => {
    const id = await question('member');
    const res = await call(answered, 'POST', { session: s.member, params: { id } });
    expect(res.status).toBe(200);
    expect(res.body.comment.answeredAt).toBeTruthy();
    expect(res.body.comment.answeredBy).toBe('Jonas Lindqvist');
    // Twice is harmless and keeps the first time.
    const again = await call(answered, 'POST', { session: s.lead, params: { id } });
    expect(again.body.comment.answeredAt).toBe(res.body.comment.answeredAt);
  });

  it('an advisor and a lead may mark any question answered', async () => {
    for (const role of ['advisor', 'lead'] as const) {
      const id = await question('member');
      expect((await call(answered, 'POST', { session: s[role], params: { id } })).status).toBe(200);
    }
  });

  it('the record’s author may; another member or alumni may not (403)', async () => {
    // The member wrote PROPULSION_2526; the lead asks there.
    const q = await ask('lead', PROPULSION_2526, 'Does the endurance prop need balancing again?', {
      kind: 'question',
    });
    const id = q.body.comment.id;
    expect((await call(answered, 'POST', { session: s.alumni, params: { id } })).status).toBe(403);
    expect((await call(answered, 'POST', { session: s.member, params: { id } })).status).toBe(200);
    const other = await question('advisor');
    expect((await call(answered, 'POST', { session: s.member, params: { id: other } })).status).toBe(403);
    expect((await call(answered, 'POST', { session: s.alumni, params: { id: other } })).status).toBe(403);
    expect((await call(answered, 'POST', { params: { id: other } })).status).toBe(401);
  });

  it('a note cannot be marked answered (409); an unknown id is 404', async () => {
    const note = await ask('member', COOLING_2425, 'Just a note on clamps.');
    expect((await call(answered, 'POST', { session: s.lead, params: { id: note.body.comment.id } })).status).toBe(409);
    expect((await call(answered, 'POST', { session: s.lead, params: { id: 'nope' } })).status).toBe(404);
  });
});

describe('GET /api/questions', () => {
  it('lists questions with their record, subsystem, asker, answers and state', async () => {
    const res = await call(questionsRoute, 'GET', { session: s.alumni });
    expect(res.status).toBe(200);
    const q = res.body.questions[0];
    for (const k of [
      'id',
      'recordId',
      'recordTitle',
      'subsystem',
      'askedBy',
      'askedAt',
      'body',
      'answers',
      'answeredAt',
    ])
      expect(q).toHaveProperty(k);
    const demoAnswered = res.body.questions.find((x: { body: string }) => x.body.startsWith('Did you ever measure'));
    expect(demoAnswered).toMatchObject({ recordId: PROPULSION_2526, subsystem: 'propulsion', answers: 1 });
    expect(demoAnswered.answeredAt).toBeTruthy();
  });

  it('filters by state and subsystem', async () => {
    const open = await call(questionsRoute, 'GET', { session: s.member, query: { state: 'open' } });
    expect(open.body.questions.length).toBeGreaterThan(0);
    expect(open.body.questions.every((q: { answeredAt: string | null }) => q.answeredAt === null)).toBe(true);
    const done = await call(questionsRoute, 'GET', { session: s.member, query: { state: 'answered' } });
    expect(done.body.questions.length).toBeGreaterThan(0);
    expect(done.body.questions.every((q: { answeredAt: string | null }) => q.answeredAt !== null)).toBe(true);
    const cooling = await call(questionsRoute, 'GET', { session: s.member, query: { subsystem: 'cooling' } });
    expect(cooling.body.questions.length).toBeGreaterThan(0);
    expect(cooling.body.questions.every((q: { subsystem: string }) => q.subsystem === 'cooling')).toBe(true);
    expect((await call(questionsRoute, 'GET', { session: s.member, query: { state: 'maybe' } })).status).toBe(400);
    expect((await call(questionsRoute, 'GET', {})).status).toBe(401);
  });

  it('never shows the questions of a deleted record, and neither does the home page', async () => {
    const rec = await call(recordsRoute, 'POST', {
      session: s.member,
      body: { kind: 'lesson', title: 'Bilge pump wiring chafed', subsystem: 'cooling', body: doc('Sleeve it.') },
    });
    const q = await ask('alumni', rec.body.record.id, 'Which sleeve did you use for the bilge wiring?', {
      kind: 'question',
    });
    const listed = async () =>
      (await call(questionsRoute, 'GET', { session: s.lead })).body.questions.some(
        (x: { id: string }) => x.id === q.body.comment.id,
      );
    expect(await listed()).toBe(true);
    expect(questionsWaitingFor(userId(demoAccounts.member)).some((x) => x.id === q.body.comment.id)).toBe(true);
    db().update(records).set({ deletedAt: new Date() }).where(eq(records.id, rec.body.record.id)).run();
    expect(await listed()).toBe(false);
    expect(questionsWaitingFor(userId(demoAccounts.member)).some((x) => x.id === q.body.comment.id)).toBe(false);
    expect((await call(answered, 'POST', { session: s.lead, params: { id: q.body.comment.id } })).status).toBe(404);
  });
});

describe('questions waiting for you', () => {
  it('alumni see open questions on subsystems they owned in earlier seasons, including the demo’s', () => {
    const waiting = questionsWaitingFor(userId(demoAccounts.alumni));
    expect(waiting.length).toBeGreaterThan(0);
    expect(waiting.every((q) => q.answeredAt === null)).toBe(true);
    expect(waiting.some((q) => q.subsystem === 'propulsion' && q.reason === 'earlier-owner')).toBe(true);
    // Their own record from 2024–25 has an open demo question about cavitation.
    expect(waiting.some((q) => q.recordId === 'demo-rec-2425-single-propeller' && q.reason === 'author')).toBe(true);
  });

  it('an author sees open questions on their records, never their own questions', () => {
    const memberId = userId(demoAccounts.member);
    const waiting = questionsWaitingFor(memberId);
    expect(waiting.some((q) => q.recordId === PROPULSION_2526 && q.reason === 'author')).toBe(true);
    expect(waiting.every((q) => q.askedBy !== 'Jonas Lindqvist')).toBe(true);
  });
});
