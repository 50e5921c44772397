import { z } from 'zod';
import { ONBOARDING_ITEM_KINDS } from '../domain';

export const onboardingItemRefSchema = z.object({
  kind: z.enum(ONBOARDING_ITEM_KINDS),
  ref: z
    .string()
    .trim()
    .min(1)
    .max(120)
    .regex(/^[A-Za-z0-9_-]+$/, 'Not a valid reference.'),
});

export const onboardingRouteSchema = z.object({
  items: z.array(onboardingItemRefSchema).max(60, 'Keep a route under 60 items.'),
});

export const onboardingProgressSchema = z.object({
  itemId: z.string().trim().min(1).max(64),
  done: z.boolean(),
});
