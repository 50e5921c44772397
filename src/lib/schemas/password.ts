import { z } from 'zod';
import { isCommonPassword, MAX_PASSWORD_LENGTH, MIN_PASSWORD_LENGTH } from '../password-rules';

/**
 * A password someone chooses (accepting an invitation, resetting). Used by the API routes and the server-rendered
 * forms alike. It carries the breach list, so keep it out of islands (it would ship the list to the browser).
 */
export const newPasswordSchema = z
  .string({ error: 'Choose a password.' })
  .min(MIN_PASSWORD_LENGTH, `Use at least ${MIN_PASSWORD_LENGTH} characters; a few unrelated words work well.`)
  .max(MAX_PASSWORD_LENGTH, `Use at most ${MAX_PASSWORD_LENGTH} characters.`)
  .refine(
    (p) => !isCommonPassword(p),
    'That password is on a list of common passwords that attackers try first; choose another.',
  );
