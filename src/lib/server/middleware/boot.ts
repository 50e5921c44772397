import { defineMiddleware } from 'astro:middleware';
import { ensureBooted } from '../boot';

/** Opens the database and warms search once per process (the start file has already migrated and seeded). */
export const boot = defineMiddleware(async (_context, next) => {
  await ensureBooted();
  return next();
});
