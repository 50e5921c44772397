import { z } from 'zod';
import { SUGGESTION_STATES } from '../domain';
import { typedLine, typedText } from './text';

export const guideReviewInputSchema = z.object({
  note: typedText().trim().max(1000).optional(),
});

export const guideSuggestionInputSchema = z.object({
  body: typedText().trim().min(1, 'Say what should change.').max(4000),
  /** One of the guide's headings; left out for the guide as a whole. */
  section: typedLine().trim().max(200).optional(),
});

export const suggestionStateInputSchema = z.object({ state: z.enum(SUGGESTION_STATES) }).strict();

export const suggestionListQuerySchema = z.object({ state: z.enum(SUGGESTION_STATES).optional() });

/** A suggestion as the API sends it. */
export interface GuideSuggestion {
  id: string;
  guideSlug: string;
  section: string | null;
  body: string;
  state: (typeof SUGGESTION_STATES)[number];
  author: string | null;
  createdAt: string;
  decidedAt: string | null;
  decidedBy: string | null;
}
