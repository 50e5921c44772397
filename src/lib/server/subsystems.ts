import { eq } from 'drizzle-orm';
import { db } from './db/client';
import { subsystems } from './db/schema';
import { recordAudit } from './audit';
import { conflict, invalidInput, notFound } from './http';
import { findSubsystem, listSubsystems, type SubsystemView } from './seasons';

type Actor = { id: string; email: string };

/** Adds a subsystem at the end of the list. */
export function createSubsystem(
  input: { slug: string; name: string; summary: string; calculationsApply?: boolean },
  actor: Actor,
): SubsystemView {
  if (findSubsystem(input.slug)) throw conflict(`A subsystem “${input.slug}” already exists.`);
  db()
    .insert(subsystems)
    .values({
      ...input,
      calculationsApply: input.calculationsApply ?? true,
      position: listSubsystems().length,
      createdAt: new Date(),
    })
    .run();
  recordAudit({ actor, action: 'subsystem.create', targetType: 'subsystem', targetId: input.slug });
  return findSubsystem(input.slug)!;
}

/** The subsystem, or 404: routes ask before reading the body, so an unknown slug answers 404 whatever is sent. */
export function requireSubsystem(slug: string): SubsystemView {
  const found = findSubsystem(slug);
  if (!found) throw notFound('That subsystem');
  return found;
}

/** Renames a subsystem, rewrites its summary or says whether calculators apply; its slug (the URL) never changes. */
export function updateSubsystem(
  current: SubsystemView,
  patch: { name?: string; summary?: string; calculationsApply?: boolean },
  actor: Actor,
): SubsystemView {
  const slug = current.slug;
  if (patch.name === undefined && patch.summary === undefined && patch.calculationsApply === undefined)
    throw invalidInput(
      [{ path: '', message: 'Send a new name, summary or calculator setting.' }],
      'Nothing to change.',
    );
  db().update(subsystems).set(patch).where(eq(subsystems.slug, slug)).run();
  recordAudit({ actor, action: 'subsystem.update', targetType: 'subsystem', targetId: slug, detail: patch });
  return { ...current, ...patch };
}
