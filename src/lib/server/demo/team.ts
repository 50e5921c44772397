import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { z } from 'zod';
import { ROLES, SEASON_PHASES } from '../../domain';

const role = z.enum(ROLES);

export const demoTeamSchema = z.object({
  team: z.object({ name: z.string(), university: z.string(), boat: z.string() }),
  seasons: z
    .array(
      z.object({
        name: z.string(),
        startsOn: z.iso.date(),
        endsOn: z.iso.date(),
        phase: z.enum(SEASON_PHASES),
        current: z.boolean(),
        boat: z.string().optional(),
      }),
    )
    .refine((s) => s.filter((x) => x.current).length === 1, 'exactly one season must be current'),
  subsystems: z.array(
    z.object({
      slug: z.string().regex(/^[a-z0-9-]+$/),
      name: z.string(),
      summary: z.string(),
      calculationsApply: z.boolean().default(true),
    }),
  ),
  people: z.array(
    z.object({
      email: z.email(),
      name: z.string(),
      role,
      demo: z.boolean().optional(),
      seasons: z.array(z.object({ season: z.string(), role, subsystems: z.array(z.string()) })),
    }),
  ),
});

export type DemoTeam = z.infer<typeof demoTeamSchema>;

export function demoDir(): string {
  return resolve(process.cwd(), 'content/demo');
}

export function loadDemoTeam(dir = demoDir()): DemoTeam {
  return demoTeamSchema.parse(JSON.parse(readFileSync(resolve(dir, 'team.json'), 'utf8')));
}

export const DEMO_PASSWORD = 'wakebook-demo';
