import { z } from 'zod';

/** An id as the app makes them (records, calculations, imports): letters, digits, `_` and `-`, at most 64. */
export const idSchema = z
  .string()
  .trim()
  .min(1)
  .max(64)
  .regex(/^[A-Za-z0-9_-]+$/, 'Not a valid id.');

/** A subsystem's slug. */
export const slugSchema = z
  .string()
  .trim()
  .min(1)
  .max(64)
  .regex(/^[a-z0-9-]+$/, 'Use a subsystem slug.');
