// The review list of an import: what each file became, and the changes the importer makes to many of its drafts at
// once (kind, subsystem, season, discard). Converting files is the import queue's business, not this module's.
import { and, asc, eq, inArray, isNull } from 'drizzle-orm';
import { db } from './db/client';
import { importItems, imports, records, seasons, subsystems } from './db/schema';
import { HttpError, conflict, invalidInput, notFound } from './http';
import { recordAudit } from './audit';
import { settings } from './config';
import { findSeason, findSubsystem } from './seasons';
import { insertRevision, softDeleteIn } from './records/write';
import { onRecordChanged } from './records/hooks';
import { INITIAL_STATUS } from '../record-rules';
import { can } from '../policy';
import type { RecordKind, Role } from '../domain';
import type { ImportLimits } from '../import-files';
import type {
  ImportBulkChangeInput,
  ImportDiscardInput,
  ImportReview,
  ImportReviewRow,
} from '../schemas/import-review';

type Actor = { id: string; email: string; role: Role };

const PREVIEW_CHARS = 240;

/** The first lines of a draft's text, for the review list. */
function previewOf(text: string): string {
  const lines = text
    .split('\n')
    .map((l) => l.trim())
    .filter(Boolean)
    .slice(0, 3)
    .join(' · ');
  return lines.length > PREVIEW_CHARS ? `${lines.slice(0, PREVIEW_CHARS - 1).trimEnd()}…` : lines;
}

/** The import, if the actor may see it: the person who started it, or a lead (as GET /api/imports/{id}). */
function loadImport(id: string, actor: Actor) {
  const row = db().select().from(imports).where(eq(imports.id, id)).get();
  if (!row) throw notFound('That import');
  if (row.userId !== actor.id && actor.role !== 'lead')
    throw new HttpError(403, 'forbidden', 'Only the person who started an import (or a lead) may review it.');
  return row;
}

/** A draft still counts as one while it is in its kind's first status (a decision's draft, a lesson's open). */
function isDraft(r: { kind: RecordKind; status: string; deletedAt: Date | null }): boolean {
  return r.deletedAt === null && r.status === INITIAL_STATUS[r.kind];
}

export function getImportReview(id: string, actor: Actor): ImportReview {
  const imp = loadImport(id, actor);
  const items = db()
    .select()
    .from(importItems)
    .where(eq(importItems.importId, imp.id))
    .orderBy(asc(importItems.position))
    .all();
  const recordIds = items.flatMap((i) => (i.recordId ? [i.recordId] : []));
  const byId = new Map(
    (recordIds.length
      ? db()
          .select({
            id: records.id,
            title: records.title,
            kind: records.kind,
            status: records.status,
            subsystem: records.subsystemSlug,
            subsystemName: subsystems.name,
            seasonId: records.seasonId,
            season: seasons.name,
            bodyText: records.bodyText,
            deletedAt: records.deletedAt,
          })
          .from(records)
          .innerJoin(subsystems, eq(subsystems.slug, records.subsystemSlug))
          .innerJoin(seasons, eq(seasons.id, records.seasonId))
          .where(inArray(records.id, recordIds))
          .all()
      : []
    ).map((r) => [r.id, r]),
  );
  const rows: ImportReviewRow[] = items.map((item) => {
    const r = item.recordId ? byId.get(item.recordId) : undefined;
    const base = {
      itemId: item.id,
      position: item.position,
      fileName: item.fileName,
      size: item.size,
      state: item.state,
      message: item.message,
      draft: null,
      existing: null,
      gone: null,
    };
    if (!r) return base;
    if (item.state === 'skipped') return { ...base, existing: r.deletedAt ? null : { id: r.id, title: r.title } };
    if (item.state !== 'done') return base;
    if (!isDraft(r)) return { ...base, gone: r.deletedAt ? 'discarded' : 'moved-on' };
    return {
      ...base,
      draft: {
        id: r.id,
        title: r.title,
        kind: r.kind,
        subsystem: r.subsystem,
        subsystemName: r.subsystemName,
        seasonId: r.seasonId,
        season: r.season,
        preview: previewOf(r.bodyText),
      },
    };
  });
  return {
    id: imp.id,
    state: imp.state,
    total: imp.total,
    done: imp.done,
    kind: imp.kind,
    subsystem: imp.subsystemSlug,
    createdAt: imp.createdAt.toISOString(),
    rows,
  };
}

/**
 * The drafts among `recordIds` that this import made and that are still drafts. Any id that is not one of them is
 * refused by name, so a bulk change never half-applies to a list the person did not see.
 */
function draftsOfImport(importId: string, recordIds: string[]) {
  const found = db()
    .select({
      id: records.id,
      title: records.title,
      kind: records.kind,
      status: records.status,
      seasonId: records.seasonId,
      subsystem: records.subsystemSlug,
      version: records.version,
      body: records.body,
      bodyText: records.bodyText,
      deletedAt: records.deletedAt,
    })
    .from(importItems)
    .innerJoin(records, eq(records.id, importItems.recordId))
    .where(
      and(
        eq(importItems.importId, importId),
        eq(importItems.state, 'done'),
        inArray(importItems.recordId, recordIds),
        isNull(records.deletedAt),
      ),
    )
    .all()
    .filter(isDraft);
  const known = new Set(found.map((r) => r.id));
  const missing = recordIds.filter((r) => !known.has(r));
  if (missing.length)
    throw invalidInput(
      missing.map((m) => ({ path: 'recordIds', message: `${m} is not a draft of this import.` })),
      'Some of the selected records are no longer drafts of this import; reload the list.',
    );
  return found;
}

/** Changes kind, subsystem and/or season of many drafts of one import; each change is a new version, audited. */
export function changeImportedDrafts(importId: string, input: ImportBulkChangeInput, actor: Actor): number {
  const imp = loadImport(importId, actor);
  if (input.subsystem && !findSubsystem(input.subsystem))
    throw invalidInput([{ path: 'subsystem', message: 'No such subsystem.' }]);
  if (input.seasonId) {
    const season = findSeason(input.seasonId);
    if (!season) throw invalidInput([{ path: 'seasonId', message: 'No such season.' }]);
    if (!can(actor, 'record:edit', { seasonIsCurrent: season.current }))
      throw new HttpError(403, 'forbidden', 'Members may move drafts into the current season only.');
  }
  const drafts = draftsOfImport(imp.id, input.recordIds);
  const now = new Date();
  const changed: string[] = [];
  db().transaction((tx) => {
    for (const r of drafts) {
      const kind = input.kind ?? r.kind;
      const next = {
        kind,
        // A draft stays a draft: a decision's first status is draft, a lesson's is open.
        status: INITIAL_STATUS[kind],
        subsystemSlug: input.subsystem ?? r.subsystem,
        seasonId: input.seasonId ?? r.seasonId,
      };
      if (next.kind === r.kind && next.subsystemSlug === r.subsystem && next.seasonId === r.seasonId) continue;
      const version = r.version + 1;
      const result = tx
        .update(records)
        .set({
          ...next,
          ...(kind !== r.kind ? { source: null } : {}),
          version,
          updatedAt: now,
          updatedById: actor.id,
        })
        .where(and(eq(records.id, r.id), eq(records.version, r.version)))
        .run();
      if (result.changes !== 1) throw conflict(`Someone saved “${r.title}” a moment ago; reload the list.`);
      insertRevision(
        tx,
        { id: r.id, version, title: r.title, status: next.status, body: r.body, bodyText: r.bodyText },
        actor.id,
        changeNote(r, next),
        now,
      );
      changed.push(r.id);
    }
  });
  for (const id of changed) {
    recordAudit({
      actor,
      action: 'record.import-change',
      targetType: 'record',
      targetId: id,
      detail: { importId: imp.id, kind: input.kind, subsystem: input.subsystem, seasonId: input.seasonId },
    });
    onRecordChanged(id);
  }
  return changed.length;
}

function changeNote(
  was: { kind: RecordKind; subsystem: string; seasonId: string },
  now: { kind: RecordKind; subsystemSlug: string; seasonId: string },
): string {
  const parts: string[] = [];
  if (was.kind !== now.kind) parts.push(`kind ${was.kind} → ${now.kind}`);
  if (was.subsystem !== now.subsystemSlug) parts.push(`subsystem ${was.subsystem} → ${now.subsystemSlug}`);
  if (was.seasonId !== now.seasonId) parts.push('season changed');
  return `Import review: ${parts.join(', ')}`;
}

/** Discards many drafts of one import (the importer or a lead); they leave every list and route. */
export function discardImportedDrafts(importId: string, input: ImportDiscardInput, actor: Actor): number {
  const imp = loadImport(importId, actor);
  const drafts = draftsOfImport(imp.id, input.recordIds);
  db().transaction((tx) => {
    for (const r of drafts)
      if (!softDeleteIn(tx, r.id, r.status, actor.id))
        throw conflict(`Someone changed “${r.title}” a moment ago; reload the list.`);
  });
  for (const r of drafts) {
    recordAudit({
      actor,
      action: 'record.discard',
      targetType: 'record',
      targetId: r.id,
      detail: { title: r.title, version: r.version, importId: imp.id },
    });
    onRecordChanged(r.id);
  }
  return drafts.length;
}

/** For the page: the review, or null when there is no such import, or 'forbidden' when it is someone else's. */
export function reviewPageOf(id: string, actor: Actor): ImportReview | null | 'forbidden' {
  try {
    return getImportReview(id, actor);
  } catch (e) {
    if (e instanceof HttpError && e.status === 404) return null;
    if (e instanceof HttpError && e.status === 403) return 'forbidden';
    throw e;
  }
}

/** The limits of one import, from the settings, for the page to say in words. */
export function importLimits(): ImportLimits {
  const s = settings();
  return {
    fileMb: s.WAKEBOOK_MAX_UPLOAD_MB,
    zipMb: s.WAKEBOOK_IMPORT_ZIP_MB,
    totalMb: s.WAKEBOOK_IMPORT_TOTAL_MB,
    files: s.WAKEBOOK_IMPORT_MAX_FILES,
  };
}
