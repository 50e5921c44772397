import { z } from 'zod';
import { idSchema as id } from './keys';
import { RECORD_KINDS, type ImportItemState, type ImportState, type RecordKind } from '../domain';

const recordIds = z
  .array(id)
  .min(1, 'Select at least one draft.')
  .max(500, 'Change at most 500 drafts at once.')
  .transform((ids) => [...new Set(ids)]);

/** Changes the kind, subsystem or season of many drafts of one import at once (the review list's bulk change). */
export const importBulkChangeSchema = z
  .object({
    recordIds,
    kind: z.enum(RECORD_KINDS, { error: 'Choose “decision” or “lesson”.' }).optional(),
    subsystem: z
      .string()
      .trim()
      .min(1)
      .max(64)
      .regex(/^[a-z0-9-]+$/, 'Use a subsystem slug.')
      .optional(),
    seasonId: id.optional(),
  })
  .strict()
  .refine((v) => v.kind !== undefined || v.subsystem !== undefined || v.seasonId !== undefined, {
    message: 'Choose a kind, a subsystem or a season to change.',
    path: ['kind'],
  });
export type ImportBulkChangeInput = z.infer<typeof importBulkChangeSchema>;

/** Discards many drafts of one import at once. */
export const importDiscardSchema = z.object({ recordIds }).strict();
export type ImportDiscardInput = z.infer<typeof importDiscardSchema>;

/** One row of the review list: an imported file and the draft it became (or why it did not). */
export interface ImportReviewRow {
  itemId: string;
  position: number;
  fileName: string;
  size: number;
  state: ImportItemState;
  message: string | null;
  /** The draft this file became, while it is still a draft of this import. */
  draft: {
    id: string;
    title: string;
    kind: RecordKind;
    subsystem: string;
    subsystemName: string;
    seasonId: string;
    season: string;
    preview: string;
  } | null;
  /** A skipped file: the record that already holds the same bytes. */
  existing: { id: string; title: string } | null;
  /** A done file whose draft was discarded, moved on from draft, or deleted since. */
  gone: 'discarded' | 'moved-on' | null;
}

export interface ImportReview {
  id: string;
  state: ImportState;
  total: number;
  done: number;
  kind: RecordKind;
  subsystem: string;
  createdAt: string;
  rows: ImportReviewRow[];
}
