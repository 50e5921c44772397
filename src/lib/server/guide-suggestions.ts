import { and, desc, eq } from 'drizzle-orm';
import { alias } from 'drizzle-orm/sqlite-core';
import type { SuggestionState } from '../domain';
import { guideHeadings } from '../guide-headings';
import type { GuideSuggestion } from '../schemas/guides';
import { recordAudit } from './audit';
import { db } from './db/client';
import { guideSuggestions, users } from './db/schema';
import { findGuide, listGuides } from './guides';
import { invalidInput, notFound } from './http';
import { newId } from './ids';

type Actor = { id: string; email: string };

const author = alias(users, 'author');
const decider = alias(users, 'decider');

function select() {
  return db()
    .select({
      id: guideSuggestions.id,
      guideSlug: guideSuggestions.guideSlug,
      section: guideSuggestions.section,
      body: guideSuggestions.body,
      state: guideSuggestions.state,
      author: author.name,
      createdAt: guideSuggestions.createdAt,
      decidedAt: guideSuggestions.decidedAt,
      decidedBy: decider.name,
    })
    .from(guideSuggestions)
    .leftJoin(author, eq(author.id, guideSuggestions.authorId))
    .leftJoin(decider, eq(decider.id, guideSuggestions.decidedById));
}

type Row = ReturnType<ReturnType<typeof select>['all']>[number];

function toSuggestion(r: Row): GuideSuggestion {
  return {
    ...r,
    createdAt: r.createdAt.toISOString(),
    decidedAt: r.decidedAt ? r.decidedAt.toISOString() : null,
  };
}

/** Anyone signed in suggests a change to a guide; the section, when given, must be one of its headings. */
export async function suggestGuideChange(slug: string, input: { body: string; section?: string }, actor: Actor) {
  const guide = await findGuide(slug);
  if (!guide) throw notFound('That guide');
  if (input.section && !guideHeadings(guide.body ?? '').some((h) => h.text === input.section))
    throw invalidInput([{ path: 'section', message: 'Pick one of the guide’s sections, or the guide as a whole.' }]);
  const id = newId();
  db()
    .insert(guideSuggestions)
    .values({
      id,
      guideSlug: slug,
      section: input.section || null,
      body: input.body,
      authorId: actor.id,
      state: 'open',
      createdAt: new Date(),
    })
    .run();
  recordAudit({ actor, action: 'guide.suggest', targetType: 'guide', targetId: slug });
  return toSuggestion(select().where(eq(guideSuggestions.id, id)).get()!);
}

/** One guide's suggestions, newest first, optionally in one state. */
export async function listGuideSuggestions(slug: string, state?: SuggestionState): Promise<GuideSuggestion[]> {
  if (!(await findGuide(slug))) throw notFound('That guide');
  return select()
    .where(and(eq(guideSuggestions.guideSlug, slug), state ? eq(guideSuggestions.state, state) : undefined))
    .orderBy(desc(guideSuggestions.createdAt))
    .all()
    .map(toSuggestion);
}

/** An advisor or lead marks a suggestion done or declined (or opens it again). */
export function decideSuggestion(id: string, state: SuggestionState, actor: Actor): GuideSuggestion {
  const found = db()
    .select({ id: guideSuggestions.id })
    .from(guideSuggestions)
    .where(eq(guideSuggestions.id, id))
    .get();
  if (!found) throw notFound('That suggestion');
  const open = state === 'open';
  db()
    .update(guideSuggestions)
    .set({ state, decidedAt: open ? null : new Date(), decidedById: open ? null : actor.id })
    .where(eq(guideSuggestions.id, id))
    .run();
  recordAudit({ actor, action: 'guide.suggestion', targetType: 'guide-suggestion', targetId: id, detail: { state } });
  return toSuggestion(select().where(eq(guideSuggestions.id, id)).get()!);
}

/** The maintainer's list: every open suggestion with its guide's title and the file to edit. */
export async function openSuggestionsForMaintainers() {
  const guides = new Map((await listGuides()).map((g) => [g.slug, g]));
  return select()
    .where(eq(guideSuggestions.state, 'open'))
    .orderBy(desc(guideSuggestions.createdAt))
    .all()
    .map((r) => {
      const g = guides.get(r.guideSlug);
      return {
        ...toSuggestion(r),
        guideTitle: g?.title ?? r.guideSlug,
        guideUrl: g?.url ?? null,
        filePath: g?.filePath ?? null,
      };
    });
}
