import { z } from 'zod';
import { typedLine, typedText } from './text';
import { SEASON_PHASES, type SeasonPhase } from '../domain';

/** A season as the server sends it and the season islands show it (islands import it as a type only). */
export interface Season {
  id: string;
  name: string;
  startsOn: string; // YYYY-MM-DD
  endsOn: string;
  phase: SeasonPhase;
  current: boolean;
  boat: string | null;
}

/** A member of the current season as the rollover offers them: continuing or becoming alumni. */
export interface RolloverMember {
  id: string;
  name: string;
  /** The names of the subsystems they own this season. */
  subsystems: string[];
}

const date = z.iso.date('Use a date like 2026-10-01.');

export const seasonCreateSchema = z
  .object({
    name: typedLine().trim().min(2, 'Name the season, e.g. 2026–27.').max(40),
    startsOn: date,
    endsOn: date,
    phase: z.enum(SEASON_PHASES).default('design'),
    boat: typedLine().trim().max(60).optional(),
  })
  .refine((s) => s.endsOn > s.startsOn, { path: ['endsOn'], message: 'The season must end after it starts.' });

export const seasonPatchSchema = z
  .object({
    name: typedLine().trim().min(2).max(40).optional(),
    startsOn: date.optional(),
    endsOn: date.optional(),
    phase: z.enum(SEASON_PHASES).optional(),
    boat: typedLine().trim().max(60).nullable().optional(),
    current: z.literal(true).optional(),
  })
  .strict();

export const rolloverSchema = z.object({
  /** Left out: every member of the current season continues. */
  continuing: z.array(z.string().min(1).max(64)).max(500).optional(),
  confirm: z.boolean().default(false),
});

export const subsystemCreateSchema = z.object({
  slug: z
    .string()
    .trim()
    .min(2)
    .max(40)
    .regex(/^[a-z0-9-]+$/, 'Lower-case letters, digits and dashes.'),
  name: typedLine().trim().min(2).max(80),
  summary: typedText().trim().max(400).default(''),
  calculationsApply: z.boolean().default(true),
});

export const subsystemPatchSchema = z
  .object({
    name: typedLine().trim().min(2).max(80).optional(),
    summary: typedText().trim().max(400).optional(),
    calculationsApply: z.boolean().optional(),
  })
  .strict();
