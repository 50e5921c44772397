import { z } from 'zod';
import { idSchema as id, slugSchema as slug } from './keys';
import { typedLine, typedText } from './text';
import { COMMENT_KINDS, LESSON_SOURCES, RECORD_KINDS, RECORD_STATUSES } from '../domain';
import { MAX_CHANGE_NOTE } from '../record-rules';

const ids = z.array(id).max(50).default([]);

export const recordKindSchema = z.enum(RECORD_KINDS);
export const lessonSourceSchema = z.enum(LESSON_SOURCES);
export const recordStatusSchema = z.enum(RECORD_STATUSES);

/** The editor document is checked against the editor's schema on the server (records/body.ts). */
const body = z.record(z.string(), z.unknown());

export const recordCreateSchema = z.object({
  kind: recordKindSchema,
  title: typedLine().trim().min(3, 'Give the record a title of at least 3 characters.').max(200),
  subsystem: slug,
  seasonId: id.optional(),
  status: recordStatusSchema.optional(),
  source: lessonSourceSchema.optional(),
  body,
  calculationIds: ids,
  relatedRecordIds: ids,
});
export type RecordCreateInput = z.infer<typeof recordCreateSchema>;

export const recordPatchSchema = z
  .object({
    version: z.number().int().min(1),
    title: typedLine().trim().min(3, 'Give the record a title of at least 3 characters.').max(200).optional(),
    subsystem: slug.optional(),
    seasonId: id.optional(),
    source: lessonSourceSchema.nullable().optional(),
    body: body.optional(),
    calculationIds: z.array(id).max(50).optional(),
    relatedRecordIds: z.array(id).max(50).optional(),
    /** Why this change, kept with the new version and shown in the history; blank means none. */
    changeNote: typedLine()
      .trim()
      .max(MAX_CHANGE_NOTE, `Keep the note to ${MAX_CHANGE_NOTE} characters; the text itself can say more.`)
      .optional(),
  })
  .strict();
export type RecordPatchInput = z.infer<typeof recordPatchSchema>;

export const recordStatusChangeSchema = z.object({
  status: recordStatusSchema,
  supersededBy: id.optional(),
  version: z.number().int().min(1).optional(),
});

export const recordListQuerySchema = z.object({
  kind: recordKindSchema.optional().or(z.literal('')),
  subsystem: slug.optional().or(z.literal('')),
  season: id.optional().or(z.literal('')),
  status: recordStatusSchema.optional().or(z.literal('')),
  limit: z.coerce.number().int().min(1).max(100).default(25),
  cursor: z.string().max(100).optional(),
});

/**
 * A question or a note on a record; an answer is a reply (`replyTo`) to a question. `parentId` is the name the first
 * API used for `replyTo` and is still accepted.
 */
export const commentInputSchema = z
  .object({
    body: typedText().trim().min(1, 'Write something first.').max(5000, 'Keep a comment under 5,000 characters.'),
    kind: z.enum(COMMENT_KINDS, { error: 'Choose “question” or “note”.' }).optional(),
    replyTo: id.optional(),
    parentId: id.optional(),
  })
  .transform(({ parentId, replyTo, ...rest }) => ({ ...rest, replyTo: replyTo ?? parentId }));
export type CommentInput = z.infer<typeof commentInputSchema>;

export const QUESTION_STATES = ['open', 'answered'] as const;
export type QuestionState = (typeof QUESTION_STATES)[number];

export const questionsQuerySchema = z.object({
  state: z.enum(QUESTION_STATES, { error: 'Use “open” or “answered”.' }).optional().or(z.literal('')),
  subsystem: slug.optional().or(z.literal('')),
});

export const reviewInputSchema = z.object({ note: typedText().trim().max(1000).optional() });
