import { z } from 'zod';
import { typedLine, typedText } from './text';
import { ROLES } from '../domain';

const subsystemSlugs = z
  .array(z.string().regex(/^[a-z0-9-]{1,64}$/, 'Not a subsystem.'))
  .max(20)
  .transform((s) => [...new Set(s)]);

export const invitationInputSchema = z.object({
  email: z
    .string()
    .trim()
    .min(1, 'Enter an e-mail address.')
    .max(254)
    .pipe(z.email('Enter a valid e-mail address.'))
    .transform((e) => e.toLowerCase()),
  name: typedLine().trim().min(2, 'Enter their name (at least 2 characters).').max(120),
  role: z.enum(ROLES, { error: 'Choose lead, advisor, member or alumni.' }),
  subsystems: subsystemSlugs.optional().default([]),
});
export type InvitationInput = z.infer<typeof invitationInputSchema>;

export const personPatchSchema = z
  .object({
    role: z.enum(ROLES, { error: 'Choose lead, advisor, member or alumni.' }).optional(),
    /** The subsystems this person owns in the current season (replaces the list). */
    subsystems: subsystemSlugs.optional(),
  })
  .refine((p) => p.role !== undefined || p.subsystems !== undefined, {
    message: 'Send a role, subsystems or both.',
    path: ['role'],
  });
export type PersonPatch = z.infer<typeof personPatchSchema>;

export const PEOPLE_SORTS = ['name', 'role', 'lastSignIn', 'email'] as const;

export const peopleQuerySchema = z.object({
  q: z.string().trim().max(120).optional(),
  role: z
    .enum(ROLES)
    .optional()
    .or(z.literal('').transform(() => undefined)),
  season: z.string().max(64).optional(),
  subsystem: z.string().max(64).optional(),
  sort: z.enum(PEOPLE_SORTS).default('name'),
  dir: z.enum(['asc', 'desc']).default('asc'),
  page: z.coerce.number().int().min(1).max(10_000).default(1),
  perPage: z.coerce.number().int().min(5).max(200).default(25),
});
export type PeopleQuery = z.infer<typeof peopleQuerySchema>;

export const mePatchSchema = z.object({
  digestOptIn: z.boolean({ error: 'Send true or false.' }),
});

/** A lead's reminder to carry on with onboarding, with an optional line of their own. */
export const nudgeSchema = z.object({ note: typedText().trim().max(500).optional() });
