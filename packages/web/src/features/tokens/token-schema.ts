import { z } from 'zod';

/** The expiry choices offered, in days; `never` sends `expiresInDays: null`. */
export const EXPIRY_CHOICES = ['7', '30', '90', '365', 'never'] as const;

// Mirrors the body of the server's POST /organisations/:id/tokens (name 1–100 characters after trimming,
// scope read or read-write, 1–3650 days or never); copied because web never imports server code.
/** The create-token form's rules. */
export const createTokenSchema = z.object({
  name: z
    .string()
    .trim()
    .min(1, 'Name the token after the pipeline or machine that will use it.')
    .max(100, 'The name is at most 100 characters.'),
  scope: z.enum(['read', 'read-write'], 'Choose what the token may do.'),
  expiry: z.enum(EXPIRY_CHOICES, 'Choose when the token expires.'),
});
export type CreateTokenValues = z.infer<typeof createTokenSchema>;

/** The form's expiry choice as the server's `expiresInDays`. */
export function toExpiresInDays(expiry: CreateTokenValues['expiry']): number | null {
  return expiry === 'never' ? null : Number(expiry);
}
