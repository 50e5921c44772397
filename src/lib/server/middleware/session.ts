import { defineMiddleware } from 'astro:middleware';
import { readSession } from '../auth/lucia';

/** Fills locals.user and locals.session from the session cookie; authorisation is decided in each page and route. */
export const readSessionIntoLocals = defineMiddleware(async (context, next) => {
  const { user, session } = await readSession(context.cookies);
  context.locals.user = user;
  context.locals.session = session;
  return next();
});
