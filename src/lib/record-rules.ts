// Record lifecycles (API.md: draft → proposed → accepted → superseded | withdrawn, proposed → withdrawn;
// open → addressed), written once and shared by the server (which enforces them) and the pages (which offer them).

export type RecordKind = 'decision' | 'lesson';

const DECISION_MOVES: Record<string, string[]> = {
  draft: ['proposed'],
  proposed: ['accepted', 'withdrawn'],
  accepted: ['superseded', 'withdrawn'],
  superseded: [],
  withdrawn: [],
};
const LESSON_MOVES: Record<string, string[]> = {
  open: ['addressed'],
  addressed: [],
};

export const STATUSES: Record<RecordKind, string[]> = {
  decision: Object.keys(DECISION_MOVES),
  lesson: Object.keys(LESSON_MOVES),
};

export const INITIAL_STATUS: Record<RecordKind, string> = { decision: 'draft', lesson: 'open' };

/** The statuses a record of this kind may move to from `from`. */
export function nextStatuses(kind: RecordKind, from: string): string[] {
  return (kind === 'decision' ? DECISION_MOVES : LESSON_MOVES)[from] ?? [];
}

export function canMove(kind: RecordKind, from: string, to: string): boolean {
  return nextStatuses(kind, from).includes(to);
}

/** Superseding always names the record that replaces it. */
export function needsReplacement(to: string): boolean {
  return to === 'superseded';
}

export function isValidStatus(kind: RecordKind, status: string): boolean {
  return STATUSES[kind].includes(status);
}
