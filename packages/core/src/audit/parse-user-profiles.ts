import { z } from 'zod';
import { InvalidArgumentError } from '../errors.js';
import { type AuditProfile, isPresetProfileName, PRESET_PROFILES } from './audit-profile.js';

const positive = z.number().positive().finite();
const nonNegative = z.number().nonnegative().finite();
const share = z.number().min(0).max(1);

const UncertaintySchema = z.strictObject({
  usblRangeFraction: nonNegative.max(1),
  usblFloorM: nonNegative,
  gnssHorizontal95M: nonNegative,
  heading95Deg: nonNegative.max(180),
  depthFloorM: nonNegative,
  depthFraction: nonNegative.max(1),
});

/** The full profile, every field required; used on a user profile after merging it onto what it extends. */
export const AuditProfileSchema = z
  .strictObject({
    name: z.string().min(1),
    description: z.string(),
    gapFactor: positive,
    gapWarnS: positive,
    gapFailS: positive,
    minFixRateHz: nonNegative,
    fixRateWindowS: positive,
    maxSpeedMps: positive,
    maxAccelerationMps2: positive,
    speedBaselineS: positive,
    maxVerticalSpeedMps: positive,
    jumpFloorM: nonNegative,
    jumpSpreadFactor: positive,
    depthJumpFloorM: nonNegative,
    maxRangeM: positive,
    surfaceDriftWarnM: positive,
    surfaceDriftFailM: positive,
    draftMinM: nonNegative,
    draftMaxM: nonNegative,
    aboveSurfaceToleranceM: nonNegative,
    flaggedShareFail: share,
    uncertainty: UncertaintySchema,
    splitGapS: positive,
    surfaceDepthM: nonNegative,
    surfaceIntervalS: nonNegative,
    smoothingAccelerationMps2: positive,
  })
  .refine((p) => p.gapFailS >= p.gapWarnS, { message: 'gapFailS must be at least gapWarnS', path: ['gapFailS'] })
  .refine((p) => p.surfaceDriftFailM >= p.surfaceDriftWarnM, {
    message: 'surfaceDriftFailM must be at least surfaceDriftWarnM',
    path: ['surfaceDriftFailM'],
  })
  .refine((p) => p.draftMaxM >= p.draftMinM, { message: 'draftMaxM must be at least draftMinM', path: ['draftMaxM'] });

/** What a user writes: `extends` names a built-in profile; every other key overrides it. */
const UserProfileSchema = z.looseObject({ extends: z.string().optional() });

/**
 * Validates the `profiles` section of a configuration file and returns complete profiles by name.
 * Each user profile may name a built-in profile in `extends` and override any of its keys
 * (`uncertainty` key by key); without `extends` every key is required. Throws
 * `InvalidArgumentError` whose message lists every problem as `profiles.<name>.<key>: <what is wrong>`.
 */
export function parseUserProfiles(raw: unknown): Record<string, AuditProfile> {
  if (raw === undefined) return {};
  const problems: string[] = [];
  const result: Record<string, AuditProfile> = {};
  if (typeof raw !== 'object' || raw === null || Array.isArray(raw))
    throw new InvalidArgumentError('profiles: expected an object of named profiles');
  for (const [name, value] of Object.entries(raw)) {
    const where = `profiles.${name}`;
    const user = UserProfileSchema.safeParse(value);
    if (!user.success) {
      problems.push(`${where}: expected an object of profile settings`);
      continue;
    }
    const { extends: base, ...overrides } = user.data;
    let merged: Record<string, unknown> = { name, description: `user profile ${name}`, ...overrides };
    if (base !== undefined) {
      if (!isPresetProfileName(base)) {
        problems.push(
          `${where}.extends: unknown profile "${base}" (valid: ${Object.keys(PRESET_PROFILES).join(', ')})`,
        );
        continue;
      }
      const preset = PRESET_PROFILES[base];
      const userUncertainty = overrides.uncertainty;
      merged = {
        ...preset,
        description: `user profile ${name} (based on ${base})`,
        ...overrides,
        name,
        uncertainty:
          typeof userUncertainty === 'object' && userUncertainty !== null && !Array.isArray(userUncertainty)
            ? { ...preset.uncertainty, ...userUncertainty }
            : (userUncertainty ?? preset.uncertainty),
      };
    }
    const parsed = AuditProfileSchema.safeParse(merged);
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const key = issue.path.join('.');
        problems.push(`${where}${key ? `.${key}` : ''}: ${issue.message}`);
      }
      continue;
    }
    result[name] = parsed.data;
  }
  if (problems.length > 0) throw new InvalidArgumentError(problems.join('; '));
  return result;
}
