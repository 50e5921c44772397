import { z } from 'zod';

export const signInInputSchema = z.object({
  email: z.string().trim().min(1, 'Enter your e-mail address.').max(254).pipe(z.email('Enter a valid e-mail address.')),
  password: z.string().min(1, 'Enter your password.').max(1024, 'That password is too long.'),
});
export type SignInInput = z.infer<typeof signInInputSchema>;
