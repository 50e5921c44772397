// Pure auth inputs, safe anywhere. The schemas that choose a password carry the breach list and live in
// lib/server/auth/new-password.ts.
import { z } from 'zod';

export const signInInputSchema = z.object({
  email: z.string().trim().min(1, 'Enter your e-mail address.').max(254).pipe(z.email('Enter a valid e-mail address.')),
  password: z.string().min(1, 'Enter your password.').max(1024, 'That password is too long.'),
});

/** Tokens from e-mailed links: URL-safe base64, never longer than this (ours are 27 characters). */
export const linkTokenSchema = z
  .string({ error: 'The link is missing its token.' })
  .min(20, 'That link is not complete; open it from the e-mail again.')
  .max(128, 'That link is not valid.')
  .regex(/^[A-Za-z0-9_-]+$/, 'That link is not valid.');

export const requestResetSchema = z.object({
  email: signInInputSchema.shape.email,
});
