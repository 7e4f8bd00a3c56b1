import { z } from 'zod';

// These mirror the server's EmailSchema and PasswordSchema (packages/server/src/routes/schemas.ts) and the
// bodies of POST /password-reset, /password-reset/complete and /invitations/accept. They are copied, not
// imported: the web bundle never imports server code (STYLE.md), and the server's module pulls in its
// services. tests/account-schemas-agree.test.ts checks that both sides accept and refuse the same values.

/** The shortest password the server accepts (the server's `PasswordSchema`). */
export const PASSWORD_MIN_LENGTH = 10;

/** An e-mail address, as the server's `EmailSchema` takes it (trimmed here first). */
export const emailField = z
  .string()
  .trim()
  .min(1, 'Enter your e-mail address.')
  .max(320, 'That e-mail address is too long.')
  .pipe(z.email('Enter an e-mail address like name@example.org.'));

/** A new password, as the server's `PasswordSchema` takes it. */
export const newPasswordField = z
  .string()
  .min(PASSWORD_MIN_LENGTH, `The password needs at least ${PASSWORD_MIN_LENGTH} characters.`)
  .max(200, 'The password is at most 200 characters.');

/** The forgotten-password form: the address to send a reset link to. */
export const forgotPasswordSchema = z.object({ email: emailField });
export type ForgotPasswordValues = z.infer<typeof forgotPasswordSchema>;

const passwordPair = z.object({ password: newPasswordField, confirmPassword: z.string() });

/** The reset form: a new password typed twice. */
export const resetPasswordSchema = passwordPair.refine((v) => v.password === v.confirmPassword, {
  path: ['confirmPassword'],
  message: 'The two passwords differ.',
});
export type ResetPasswordValues = z.infer<typeof resetPasswordSchema>;

/** Accepting an invitation as someone new: a display name and a password typed twice. */
export const newAccountSchema = passwordPair
  .extend({
    displayName: z
      .string()
      .trim()
      .min(1, 'Enter your name as colleagues should see it.')
      .max(200, 'At most 200 characters.'),
  })
  .refine((v) => v.password === v.confirmPassword, { path: ['confirmPassword'], message: 'The two passwords differ.' });
export type NewAccountValues = z.infer<typeof newAccountSchema>;
