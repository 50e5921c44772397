// Record lifecycles (API.md: draft → proposed → accepted → superseded | withdrawn, proposed → withdrawn;
// open → addressed), written once and shared by the server (which enforces them) and the pages (which offer them).
import {
  DECISION_STATUSES,
  LESSON_STATUSES,
  type DecisionStatus,
  type LessonStatus,
  type RecordKind,
  type RecordStatus,
} from './domain';

import type { Action } from './policy';

export type { RecordKind } from './domain';

const DECISION_MOVES: Record<DecisionStatus, readonly DecisionStatus[]> = {
  draft: ['proposed'],
  proposed: ['accepted', 'withdrawn'],
  accepted: ['superseded', 'withdrawn'],
  superseded: [],
  withdrawn: [],
};
const LESSON_MOVES: Record<LessonStatus, readonly LessonStatus[]> = {
  open: ['addressed'],
  addressed: [],
};

const STATUSES: Record<RecordKind, readonly RecordStatus[]> = {
  decision: DECISION_STATUSES,
  lesson: LESSON_STATUSES,
};

export const INITIAL_STATUS: Record<RecordKind, RecordStatus> = {
  decision: DECISION_STATUSES[0],
  lesson: LESSON_STATUSES[0],
};

/** The statuses a record of this kind may move to from `from`. */
export function nextStatuses(kind: RecordKind, from: string): readonly RecordStatus[] {
  const moves: Record<string, readonly RecordStatus[] | undefined> =
    kind === 'decision' ? DECISION_MOVES : LESSON_MOVES;
  return moves[from] ?? [];
}

export function canMove(kind: RecordKind, from: string, to: string): boolean {
  return nextStatuses(kind, from).some((s) => s === to);
}

/** A change note ("why this change") is one short sentence kept with the version it explains. */
export const MAX_CHANGE_NOTE = 280;

/** Superseding always names the record that replaces it. */
export function needsReplacement(to: string): boolean {
  return to === 'superseded';
}

export function isValidStatus(kind: RecordKind, status: string): boolean {
  return STATUSES[kind].some((s) => s === status);
}

/**
 * What a decision still needs before it can be accepted, in words for the facts panel; null when nothing is
 * pending (accepted, or its story is over) and for lessons. Mirrors the server's rule in records/write.ts.
 */
export function acceptanceNeeds(r: { kind: RecordKind; status: string; reviewedCurrent: boolean }): string | null {
  if (r.kind !== 'decision') return null;
  if (r.status === 'draft')
    return 'Still a draft: its author proposes it to the team, then an advisor or a lead reviews it.';
  if (r.status !== 'proposed') return null;
  return r.reviewedCurrent
    ? 'Reviewed: ready to be accepted.'
    : 'Waiting for a review: an advisor or a lead reviews this version, or accepts it.';
}

/** The permission a status move asks for (lib/policy.ts): advisors may accept and withdraw, nothing else. */
export function actionForMove(to: string): Action {
  return to === 'accepted' ? 'record:accept' : to === 'withdrawn' ? 'record:withdraw' : 'record:status';
}
