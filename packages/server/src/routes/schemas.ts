import { z } from 'zod';
import { ROLES } from '../services/roles.js';

/** Shared pieces of request and response schemas. */
export const RoleSchema = z.enum(ROLES).describe('viewer < editor < admin');
export const UuidSchema = z.uuid();
export const EmailSchema = z.email().max(320);
/** At least 10 characters: length matters more than composition (NIST SP 800-63B §3.1.1.2 asks for ≥ 8). */
export const PasswordSchema = z.string().min(10, 'The password needs at least 10 characters.').max(200);
export const TimestampSchema = z.iso.datetime().describe('ISO 8601 UTC timestamp');
export const OrganisationParams = z.object({ organisationId: UuidSchema });

export const UserSchema = z.object({
  id: UuidSchema,
  email: z.string(),
  displayName: z.string(),
  createdAt: TimestampSchema,
});

export const CurrentUserSchema = z.object({
  user: UserSchema,
  memberships: z.array(
    z.object({
      organisationId: UuidSchema,
      organisationName: z.string(),
      organisationSlug: z.string(),
      role: RoleSchema,
    }),
  ),
});
