import { describe, expect, it } from 'vitest';
import { EmailSchema, PasswordSchema, RoleSchema } from '../packages/server/src/routes/schemas.js';
import { emailField, newPasswordField } from '../packages/web/src/features/auth/account-schemas.js';
import { inviteSchema } from '../packages/web/src/features/members/invite-schema.js';

// The web forms mirror the server's schemas instead of importing them (the web bundle never imports
// server code); these cases keep both sides refusing and accepting the same values.
describe('web account schemas against the server schemas', () => {
  const emails = [
    'maren@hollowtide.example',
    'tove.lindqvist+dives@hollowtide.example',
    'no-at-sign.example',
    'two@@hollowtide.example',
    'trailing@',
    '',
    `${'a'.repeat(310)}@hollowtide.example`,
  ];
  it.each(emails)('agree on the address %j', (email) => {
    expect(emailField.safeParse(email).success).toBe(EmailSchema.safeParse(email).success);
  });

  const passwords = ['', 'nine-char', 'ten-chars!', 'tide tables at dawn', 'x'.repeat(200), 'x'.repeat(201)];
  it.each(passwords)('agree on the password %j', (password) => {
    expect(newPasswordField.safeParse(password).success).toBe(PasswordSchema.safeParse(password).success);
  });

  it('offer the same roles', () => {
    expect(inviteSchema.shape.role.options).toEqual(RoleSchema.options);
  });
});
