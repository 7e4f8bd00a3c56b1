import { z } from 'zod';

/** The sign-in form's rules: the same limits as the server's `POST /session` body. */
export const signInSchema = z.object({
  email: z
    .string()
    .trim()
    .min(1, 'Enter your e-mail address.')
    .max(320, 'That e-mail address is too long.')
    .pipe(z.email('Enter an e-mail address like name@example.org.')),
  password: z.string().min(1, 'Enter your password.').max(200, 'The password is at most 200 characters.'),
});

/** The sign-in form's values. */
export type SignInValues = z.infer<typeof signInSchema>;
