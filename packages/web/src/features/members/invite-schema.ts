import { z } from 'zod';

// Mirrors the body of the server's POST /organisations/:id/invitations (EmailSchema, RoleSchema in
// packages/server/src/routes/schemas.ts); copied because web never imports server code.
/** The invite form's rules. */
export const inviteSchema = z.object({
  email: z
    .string()
    .trim()
    .min(1, 'Enter the e-mail address to invite.')
    .max(320, 'That e-mail address is too long.')
    .pipe(z.email('Enter an e-mail address like name@example.org.')),
  role: z.enum(['viewer', 'editor', 'admin'], 'Choose a role.'),
});
export type InviteValues = z.infer<typeof inviteSchema>;
