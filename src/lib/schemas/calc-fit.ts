import { z } from 'zod';
import { rawInputsSchema } from './calculations';

/** Largest test log the fit route takes, in points. */
export const FIT_MAX_POINTS = 5000;

const point = z.object({
  speed_mps: z
    .number({ error: 'Speed must be a number (m/s).' })
    .positive('Speed must be above 0 m/s.')
    .max(30, 'Speed must be at most 30 m/s.'),
  power_W: z
    .number({ error: 'Power must be a number (W).' })
    .min(0, 'Power cannot be negative.')
    .max(1_000_000, 'Power must be at most 1 MW.'),
});

export const resistanceFitSchema = z.object({
  inputs: rawInputsSchema.default({}),
  points: z
    .array(point, { error: 'Give the logged points as a list of {speed_mps, power_W}.' })
    .min(3, 'Give at least three logged points.')
    .max(FIT_MAX_POINTS, `Give at most ${FIT_MAX_POINTS} points.`)
    .refine((ps) => new Set(ps.map((p) => p.speed_mps)).size >= 2, 'The points need at least two different speeds.'),
  drivetrainEfficiency: z
    .number({ error: 'Drivetrain efficiency must be a number between 0 and 1.' })
    .gt(0, 'Drivetrain efficiency must be above 0.')
    .max(1, 'Drivetrain efficiency must be at most 1.'),
});
export type ResistanceFitInput = z.infer<typeof resistanceFitSchema>;
