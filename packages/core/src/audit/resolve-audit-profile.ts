import { InvalidArgumentError } from '../errors.js';
import { type AuditProfile, isPresetProfileName, PRESET_PROFILES } from './audit-profile.js';

/**
 * Finds a profile by name among the user profiles (first) and the built-in ones. Throws
 * `InvalidArgumentError` naming the valid profiles when there is none by that name.
 */
export function resolveAuditProfile(
  name: string,
  userProfiles: Readonly<Record<string, AuditProfile>> = {},
): AuditProfile {
  const user = userProfiles[name];
  if (user !== undefined) return user;
  if (isPresetProfileName(name)) return PRESET_PROFILES[name];
  const valid = [...Object.keys(PRESET_PROFILES), ...Object.keys(userProfiles)].join(', ');
  throw new InvalidArgumentError(`unknown profile "${name}" (valid: ${valid})`);
}
