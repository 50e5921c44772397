// The inputs that choose a password (accepting an invitation, resetting, changing it), for the API routes and the
// server-rendered forms. They live under lib/server because they carry the breach list.
import { z } from 'zod';
import { linkTokenSchema } from '../../schemas/auth';
import { MAX_PASSWORD_LENGTH, MIN_PASSWORD_LENGTH } from '../../password-rules';
import { isCommonPassword } from './common-passwords';
import { typedLine } from '../../schemas/text';

const newPasswordSchema = z
  .string({ error: 'Choose a password.' })
  .min(MIN_PASSWORD_LENGTH, `Use at least ${MIN_PASSWORD_LENGTH} characters; a few unrelated words work well.`)
  .max(MAX_PASSWORD_LENGTH, `Use at most ${MAX_PASSWORD_LENGTH} characters.`)
  .refine(
    (p) => !isCommonPassword(p),
    'That password is on a list of common passwords that attackers try first; choose another.',
  );

export const acceptInvitationSchema = z.object({
  token: linkTokenSchema,
  password: newPasswordSchema,
  name: typedLine().trim().min(2, 'Enter your name (at least 2 characters).').max(120).optional(),
});
export type AcceptInvitationInput = z.infer<typeof acceptInvitationSchema>;

export const resetPasswordSchema = z.object({
  token: linkTokenSchema,
  password: newPasswordSchema,
});

/** A signed-in person changing their own password: the current one proves it is them, not a borrowed session. */
export const changePasswordSchema = z
  .object({
    currentPassword: z
      .string({ error: 'Enter your current password.' })
      .min(1, 'Enter your current password.')
      .max(MAX_PASSWORD_LENGTH, 'That is not your current password.'),
    newPassword: newPasswordSchema,
  })
  .refine((v) => v.currentPassword !== v.newPassword, {
    path: ['newPassword'],
    message: 'Choose a password different from your current one.',
  });
export type ChangePasswordInput = z.infer<typeof changePasswordSchema>;
