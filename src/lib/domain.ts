// The product's fixed lists, written once. The Drizzle schema, the zod schemas, the rules and the islands all take
// their values from here, so adding a status or a role is one edit. Pure: no imports, safe for islands.

export const ROLES = ['lead', 'advisor', 'member', 'alumni'] as const;
export type Role = (typeof ROLES)[number];

/** The phase a season is in; the season admin offers them in this order. */
export const SEASON_PHASES = ['design', 'build', 'test', 'race', 'handover'] as const;
export type SeasonPhase = (typeof SEASON_PHASES)[number];

export const RECORD_KINDS = ['decision', 'lesson'] as const;
export type RecordKind = (typeof RECORD_KINDS)[number];

/** A decision's statuses; the first is where a new decision starts (moves are in record-rules.ts). */
export const DECISION_STATUSES = ['draft', 'proposed', 'accepted', 'superseded', 'withdrawn'] as const;
export type DecisionStatus = (typeof DECISION_STATUSES)[number];

/** A lesson's statuses; the first is where a new lesson starts. */
export const LESSON_STATUSES = ['open', 'addressed'] as const;
export type LessonStatus = (typeof LESSON_STATUSES)[number];

export const RECORD_STATUSES = [...DECISION_STATUSES, ...LESSON_STATUSES] as const;
export type RecordStatus = (typeof RECORD_STATUSES)[number];

/** Where a lesson was learnt. */
export const LESSON_SOURCES = ['testing', 'building', 'racing', 'organising'] as const;
export type LessonSource = (typeof LESSON_SOURCES)[number];

/** How one record points at another; `supersedes` runs from the newer record to the one it replaces. */
export const RECORD_LINK_KINDS = ['related', 'supersedes'] as const;

/** What a step of an onboarding route points at. */
export const ONBOARDING_ITEM_KINDS = ['guide', 'record', 'calculation'] as const;

/** A comment on a record is a question (which can be answered) or a note. Answers are notes replying to a question. */
export const COMMENT_KINDS = ['question', 'note'] as const;
export type CommentKind = (typeof COMMENT_KINDS)[number];

/** Where a suggested change to a guide stands. */
export const SUGGESTION_STATES = ['open', 'done', 'declined'] as const;
export type SuggestionState = (typeof SUGGESTION_STATES)[number];

/** Where an import of files stands, and where each of its files stands. */
export const IMPORT_STATES = ['queued', 'running', 'done'] as const;
export type ImportState = (typeof IMPORT_STATES)[number];
export const IMPORT_ITEM_STATES = ['queued', 'done', 'skipped', 'failed'] as const;
export type ImportItemState = (typeof IMPORT_ITEM_STATES)[number];
/** The file name endings an import reads (a .zip is opened and each file in it read on its own). */
export const IMPORT_EXTENSIONS = ['docx', 'md', 'markdown', 'html', 'htm', 'txt', 'pdf', 'zip'] as const;
