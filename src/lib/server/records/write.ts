import { and, eq, inArray, isNull } from 'drizzle-orm';
import { db } from '../db/client';
import { attachments, onboardingItems, recordCalculations, recordLinks, recordRevisions, records } from '../db/schema';
import { HttpError, conflict, invalidInput, notFound } from '../http';
import { newId } from '../ids';
import { recordAudit } from '../audit';
import { currentSeason, findSeason, findSubsystem } from '../seasons';
import { existingCalculationIds } from '../calculations';
import { processBody } from './body';
import { attachmentIdOf } from '../../editor/links';
import type { JSONContent } from '@tiptap/core';
import { getRecordView, type RecordView } from './view';
import { actionForMove, canMove, INITIAL_STATUS, isValidStatus, needsReplacement } from '../../record-rules';
import type { RecordStatus, Role } from '../../domain';
import { can, type Action } from '../../policy';
import type { RecordCreateInput, RecordPatchInput } from '../../schemas/records';
import { onRecordChanged } from './hooks';

type Actor = { id: string; email: string; role: Role };
type Tx = Parameters<Parameters<ReturnType<typeof db>['transaction']>[0]>[0];

function forbidden(message = 'Your role may not do this.') {
  return new HttpError(403, 'forbidden', message);
}

function checkIds(ids: string[], existing: Set<string>, path: string) {
  const missing = ids.filter((i) => !existing.has(i));
  if (missing.length) throw invalidInput(missing.map((m) => ({ path, message: `No such item: ${m}.` })));
}

/** The attachment ids the images in a (validated) document show. */
function imageAttachmentIds(n: JSONContent): string[] {
  const own = n.type === 'image' ? [attachmentIdOf(n.attrs?.src)].filter((i): i is string => i !== null) : [];
  return [...own, ...(n.content ?? []).flatMap(imageAttachmentIds)];
}

/** An image in a record's text shows one of that record's own attachments, never another record's. */
function checkImages(doc: JSONContent, allowed: (ids: string[]) => Set<string>) {
  const ids = [...new Set(imageAttachmentIds(doc))];
  if (ids.length === 0) return;
  const own = allowed(ids);
  if (ids.some((i) => !own.has(i)))
    throw invalidInput([
      { path: 'body', message: 'An image in the text shows a file that is not attached to this record.' },
    ]);
}

function existingRecordIds(ids: string[]): Set<string> {
  if (ids.length === 0) return new Set();
  return new Set(
    db()
      .select({ id: records.id })
      .from(records)
      .where(and(inArray(records.id, ids), isNull(records.deletedAt)))
      .all()
      .map((r) => r.id),
  );
}

function replaceLinks(tx: Tx, recordId: string, calculationIds?: string[], relatedIds?: string[]) {
  const now = new Date();
  if (calculationIds) {
    tx.delete(recordCalculations).where(eq(recordCalculations.recordId, recordId)).run();
    for (const c of new Set(calculationIds)) tx.insert(recordCalculations).values({ recordId, calculationId: c }).run();
  }
  if (relatedIds) {
    tx.delete(recordLinks)
      .where(and(eq(recordLinks.fromRecordId, recordId), eq(recordLinks.kind, 'related')))
      .run();
    for (const r of new Set(relatedIds)) {
      if (r !== recordId)
        tx.insert(recordLinks).values({ fromRecordId: recordId, toRecordId: r, kind: 'related', createdAt: now }).run();
    }
  }
}

export function insertRevision(
  tx: Tx,
  r: { id: string; version: number; title: string; status: RecordStatus; body: unknown; bodyText: string },
  editorId: string,
  note: string | null,
  at: Date,
) {
  tx.insert(recordRevisions)
    .values({
      id: newId(),
      recordId: r.id,
      version: r.version,
      title: r.title,
      status: r.status,
      body: r.body,
      bodyText: r.bodyText,
      editorId,
      note,
      createdAt: at,
    })
    .run();
}

/**
 * `imageAttachmentIds`: the attachments the caller adds to the new record with it (an import's pictures), which its
 * text may show; a record created any other way has none yet, so its text shows no image.
 */
export function createRecord(
  input: RecordCreateInput,
  actor: Actor,
  options: { imageAttachmentIds?: string[] } = {},
): RecordView {
  if (!findSubsystem(input.subsystem)) throw invalidInput([{ path: 'subsystem', message: 'No such subsystem.' }]);
  const season = input.seasonId ? findSeason(input.seasonId) : currentSeason();
  if (!season)
    throw invalidInput([
      { path: 'seasonId', message: input.seasonId ? 'No such season.' : 'No season is current; choose one.' },
    ]);
  if (!can(actor, 'record:edit', { seasonIsCurrent: season.current }))
    throw forbidden('Members write records of the current season only.');
  const status = input.status ?? INITIAL_STATUS[input.kind];
  if (!isValidStatus(input.kind, status) || needsReplacement(status)) {
    throw invalidInput([{ path: 'status', message: `A new ${input.kind} cannot start as “${status}”.` }]);
  }
  if (input.kind === 'decision' && input.source)
    throw invalidInput([{ path: 'source', message: 'Only lessons have a source.' }]);
  checkIds(input.calculationIds, existingCalculationIds(input.calculationIds), 'calculationIds');
  checkIds(input.relatedRecordIds, existingRecordIds(input.relatedRecordIds), 'relatedRecordIds');
  const body = processBody(input.body);
  // A new record holds no attachments yet, except those its import adds with it.
  checkImages(body.doc, (ids) => new Set(ids.filter((i) => options.imageAttachmentIds?.includes(i))));
  const id = newId();
  const now = new Date();
  db().transaction((tx) => {
    tx.insert(records)
      .values({
        id,
        kind: input.kind,
        title: input.title,
        subsystemSlug: input.subsystem,
        seasonId: season.id,
        status,
        source: input.kind === 'lesson' ? (input.source ?? null) : null,
        authorId: actor.id,
        body: body.doc,
        bodyHtml: body.html,
        bodyText: body.text,
        version: 1,
        createdAt: now,
        updatedAt: now,
        updatedById: actor.id,
      })
      .run();
    insertRevision(
      tx,
      { id, version: 1, title: input.title, status, body: body.doc, bodyText: body.text },
      actor.id,
      'Created',
      now,
    );
    replaceLinks(tx, id, input.calculationIds, input.relatedRecordIds);
  });
  recordAudit({
    actor,
    action: 'record.create',
    targetType: 'record',
    targetId: id,
    detail: { kind: input.kind, title: input.title },
  });
  onRecordChanged(id);
  return getRecordView(id)!;
}

/** Loads a record and checks the actor may change it (members: current season only). */
export function loadForWrite(id: string, actor: Actor, action: Action = 'record:edit') {
  const current = getRecordView(id);
  if (!current) throw notFound('That record');
  if (!can(actor, action, { seasonIsCurrent: current.seasonIsCurrent })) {
    throw forbidden(
      actor.role === 'member'
        ? 'Records of past seasons are kept as they were; only leads may change them.'
        : 'Your role may not change records.',
    );
  }
  return current;
}

/** Saves an edit made on `version`. A stale version is refused with the current record, so nothing is overwritten. */
export function updateRecord(id: string, patch: RecordPatchInput, actor: Actor): RecordView {
  const current = loadForWrite(id, actor);
  if (patch.version !== current.version) {
    throw conflict(`Someone saved version ${current.version} while you edited version ${patch.version}.`, { current });
  }
  if (patch.subsystem && !findSubsystem(patch.subsystem))
    throw invalidInput([{ path: 'subsystem', message: 'No such subsystem.' }]);
  let seasonId = current.seasonId;
  if (patch.seasonId && patch.seasonId !== current.seasonId) {
    const season = findSeason(patch.seasonId);
    if (!season) throw invalidInput([{ path: 'seasonId', message: 'No such season.' }]);
    if (!can(actor, 'record:edit', { seasonIsCurrent: season.current }))
      throw forbidden('Members may not move a record into a past season.');
    seasonId = season.id;
  }
  if (current.kind === 'decision' && patch.source)
    throw invalidInput([{ path: 'source', message: 'Only lessons have a source.' }]);
  if (patch.calculationIds)
    checkIds(patch.calculationIds, existingCalculationIds(patch.calculationIds), 'calculationIds');
  if (patch.relatedRecordIds)
    checkIds(patch.relatedRecordIds, existingRecordIds(patch.relatedRecordIds), 'relatedRecordIds');
  const body = patch.body ? processBody(patch.body) : null;
  if (body)
    checkImages(body.doc, (ids) => {
      const rows = db()
        .select({ id: attachments.id })
        .from(attachments)
        .where(and(eq(attachments.recordId, id), inArray(attachments.id, ids)))
        .all();
      return new Set(rows.map((r) => r.id));
    });
  const now = new Date();
  const next = current.version + 1;
  const title = patch.title ?? current.title;
  db().transaction((tx) => {
    // The version check and the write are one statement: two saves of the same version cannot both succeed.
    const result = tx
      .update(records)
      .set({
        title,
        subsystemSlug: patch.subsystem ?? current.subsystem,
        seasonId,
        source: patch.source === undefined ? current.source : patch.source,
        ...(body ? { body: body.doc, bodyHtml: body.html, bodyText: body.text } : {}),
        version: next,
        updatedAt: now,
        updatedById: actor.id,
      })
      .where(and(eq(records.id, id), eq(records.version, patch.version)))
      .run();
    if (result.changes !== 1) throw conflict('Someone saved this record a moment ago.', {});
    const stored = tx
      .select({ body: records.body, bodyText: records.bodyText, status: records.status })
      .from(records)
      .where(eq(records.id, id))
      .get()!;
    insertRevision(
      tx,
      { id, version: next, title, status: stored.status, body: stored.body, bodyText: stored.bodyText },
      actor.id,
      patch.changeNote || null,
      now,
    );
    replaceLinks(tx, id, patch.calculationIds, patch.relatedRecordIds);
  });
  recordAudit({ actor, action: 'record.update', targetType: 'record', targetId: id, detail: { version: next } });
  onRecordChanged(id);
  return getRecordView(id)!;
}

export function changeStatus(
  id: string,
  input: { status: RecordStatus; supersededBy?: string; version?: number },
  actor: Actor,
): RecordView {
  const current = loadForWrite(id, actor, actionForMove(input.status));
  if (input.version !== undefined && input.version !== current.version) {
    throw conflict(`Someone saved version ${current.version} while you looked at version ${input.version}.`, {
      current,
    });
  }
  if (!isValidStatus(current.kind, input.status)) {
    throw invalidInput([{ path: 'status', message: `A ${current.kind} has no status “${input.status}”.` }]);
  }
  if (!canMove(current.kind, current.status, input.status)) {
    throw conflict(`A ${current.kind} cannot move from “${current.status}” to “${input.status}”.`, {
      current: { status: current.status, version: current.version },
    });
  }
  if (input.status === 'accepted' && current.kind === 'decision' && !acceptable(current, actor)) {
    throw conflict(
      `Version ${current.version} needs a review before it can be accepted: an advisor or a lead reviews it (or accepts it themselves).`,
      { current: { status: current.status, version: current.version } },
    );
  }
  let replacement: RecordView | null = null;
  if (needsReplacement(input.status)) {
    if (!input.supersededBy)
      throw invalidInput([{ path: 'supersededBy', message: 'Name the record that supersedes this one.' }]);
    if (input.supersededBy === id)
      throw invalidInput([{ path: 'supersededBy', message: 'A record cannot supersede itself.' }]);
    replacement = getRecordView(input.supersededBy);
    if (!replacement) throw invalidInput([{ path: 'supersededBy', message: 'No such record.' }]);
    if (replacement.kind !== 'decision')
      throw invalidInput([{ path: 'supersededBy', message: 'Only a decision record can supersede a decision.' }]);
    if (['superseded', 'withdrawn'].includes(replacement.status))
      throw invalidInput([{ path: 'supersededBy', message: 'The replacement is itself superseded or withdrawn.' }]);
    // Otherwise an unreviewed draft could push aside a decision that went through review.
    if (replacement.status !== 'accepted')
      throw invalidInput([
        {
          path: 'supersededBy',
          message: `“${replacement.title}” is ${replacement.status}; a decision is replaced only by an accepted one.`,
        },
      ]);
  }
  const now = new Date();
  const next = current.version + 1;
  db().transaction((tx) => {
    const result = tx
      .update(records)
      .set({
        status: input.status,
        version: next,
        updatedAt: now,
        updatedById: actor.id,
        // The text did not change, so a review of it still holds for the new version.
        ...(current.reviewed?.current ? { reviewedVersion: next } : {}),
      })
      .where(and(eq(records.id, id), eq(records.version, current.version)))
      .run();
    if (result.changes !== 1) throw conflict('Someone saved this record a moment ago.', {});
    const stored = tx
      .select({ body: records.body, bodyText: records.bodyText, title: records.title })
      .from(records)
      .where(eq(records.id, id))
      .get()!;
    insertRevision(
      tx,
      { id, version: next, title: stored.title, status: input.status, body: stored.body, bodyText: stored.bodyText },
      actor.id,
      `Status: ${current.status} → ${input.status}`,
      now,
    );
    if (replacement) {
      tx.insert(recordLinks)
        .values({ fromRecordId: replacement.id, toRecordId: id, kind: 'supersedes', createdAt: now })
        .onConflictDoNothing()
        .run();
    }
  });
  recordAudit({
    actor,
    action: 'record.status',
    targetType: 'record',
    targetId: id,
    detail: { from: current.status, to: input.status, supersededBy: replacement?.id },
  });
  onRecordChanged(id);
  if (replacement) onRecordChanged(replacement.id);
  return getRecordView(id)!;
}

/** Refuses, before anything is read, someone who may make no status move at all (alumni). */
export function requireSomeStatusRight(actor: Actor): void {
  const any = { seasonIsCurrent: true };
  if (!(['record:status', 'record:accept', 'record:withdraw'] as const).some((a) => can(actor, a, any)))
    throw forbidden('Your role may not change the status of records.');
}

/**
 * A decision becomes accepted by someone who may review it (advisors, leads: accepting is their review), or by
 * anyone allowed once its current version has been reviewed — reviews are only ever written by advisors and leads.
 */
function acceptable(current: RecordView, actor: Actor): boolean {
  return can(actor, 'record:review') || current.reviewed?.current === true;
}

/**
 * Marks a record still in `status` deleted and takes it off onboarding routes (a step pointing at it would only show
 * as "no longer exists"). False when it has moved on or is gone already.
 */
export function softDeleteIn(tx: Tx, id: string, status: RecordStatus, actorId: string): boolean {
  const gone = tx
    .update(records)
    .set({ deletedAt: new Date(), updatedById: actorId })
    .where(and(eq(records.id, id), eq(records.status, status), isNull(records.deletedAt)))
    .run();
  if (gone.changes !== 1) return false;
  tx.delete(onboardingItems)
    .where(and(eq(onboardingItems.kind, 'record'), eq(onboardingItems.ref, id)))
    .run();
  return true;
}

/** Deletes a draft for good (its author or a lead). Anything further along stays: withdraw it instead. */
export function discardDraft(id: string, actor: Actor): void {
  const current = getRecordView(id);
  if (!current) throw notFound('That record');
  if (!can(actor, 'record:discard', { isOwn: current.author?.id === actor.id }))
    throw forbidden('Only the author of a draft or a lead may discard it.');
  if (current.status !== 'draft')
    throw conflict(
      `Only drafts can be discarded; this ${current.kind} is ${current.status}.${current.kind === 'decision' ? ' Withdraw it instead: it stays readable, marked withdrawn.' : ''}`,
      { current: { status: current.status, version: current.version } },
    );
  db().transaction((tx) => {
    if (!softDeleteIn(tx, id, 'draft', actor.id)) throw conflict('Someone changed this record a moment ago.', {});
  });
  recordAudit({
    actor,
    action: 'record.discard',
    targetType: 'record',
    targetId: id,
    detail: { title: current.title, version: current.version },
  });
  onRecordChanged(id);
}

export function reviewRecord(id: string, note: string | undefined, actor: Actor): RecordView {
  const current = getRecordView(id);
  if (!current) throw notFound('That record');
  db()
    .update(records)
    .set({ reviewedById: actor.id, reviewedAt: new Date(), reviewedVersion: current.version, reviewNote: note ?? null })
    .where(eq(records.id, id))
    .run();
  recordAudit({
    actor,
    action: 'record.review',
    targetType: 'record',
    targetId: id,
    detail: { version: current.version },
  });
  return getRecordView(id)!;
}
