import { existsSync, readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { z } from 'zod';
import { ONBOARDING_ITEM_KINDS } from '../../domain';
import { onboardingItems, onboardingProgress } from '../db/schema';
import { newId } from '../ids';
import type { SeedIds, Tx } from './seed-types';

const schema = z.object({
  routes: z.record(z.string(), z.array(z.object({ kind: z.enum(ONBOARDING_ITEM_KINDS), ref: z.string() }))),
  progress: z.record(z.email(), z.record(z.string(), z.array(z.string()))).default({}),
});

export function loadDemoOnboarding(dir: string) {
  const file = resolve(dir, 'onboarding.json');
  return existsSync(file) ? schema.parse(JSON.parse(readFileSync(file, 'utf8'))) : { routes: {}, progress: {} };
}

/** Routes are seeded as data (guide slugs are checked against the collection by the route tests). */
export function seedOnboarding(tx: Tx, ids: SeedIds, data: ReturnType<typeof loadDemoOnboarding>): void {
  const now = new Date();
  const itemId = new Map<string, string>();
  for (const [slug, items] of Object.entries(data.routes)) {
    items.forEach((it, position) => {
      const id = newId();
      itemId.set(`${slug}:${it.ref}`, id);
      tx.insert(onboardingItems)
        .values({ id, subsystemSlug: slug, position, kind: it.kind, ref: it.ref, createdAt: now })
        .run();
    });
  }
  for (const [email, bySubsystem] of Object.entries(data.progress)) {
    const userId = ids.userIdByEmail.get(email);
    if (!userId) throw new Error(`demo onboarding: unknown person ${email}`);
    for (const [slug, refs] of Object.entries(bySubsystem)) {
      for (const ref of refs) {
        const id = itemId.get(`${slug}:${ref}`);
        if (!id) throw new Error(`demo onboarding: ${ref} is not on the ${slug} route`);
        tx.insert(onboardingProgress).values({ userId, itemId: id, doneAt: now }).run();
      }
    }
  }
}
