import { describe, expect, it } from 'vitest';
import { InvalidArgumentError } from '../errors.js';
import { PRESET_PROFILES } from './audit-profile.js';
import { parseAuditSetup } from './parse-audit-setup.js';
import { AuditProfileSchema, parseUserProfiles } from './parse-user-profiles.js';
import { resolveAuditProfile } from './resolve-audit-profile.js';

describe('parseUserProfiles', () => {
  it('merges a user profile onto the preset it extends, uncertainty key by key', () => {
    const profiles = parseUserProfiles({
      'harbour-rov': { extends: 'inspection-rov', maxSpeedMps: 1.2, uncertainty: { gnssHorizontal95M: 0.05 } },
    });
    const p = profiles['harbour-rov'];
    expect(p?.maxSpeedMps).toBe(1.2);
    expect(p?.uncertainty.gnssHorizontal95M).toBe(0.05);
    expect(p?.uncertainty.usblRangeFraction).toBe(PRESET_PROFILES['inspection-rov'].uncertainty.usblRangeFraction);
    expect(p?.name).toBe('harbour-rov');
  });

  it('names every bad key in one message', () => {
    const attempt = () =>
      parseUserProfiles({
        a: { extends: 'inspection-rov', maxSpeedMps: -1, gapWarnS: 'ten' },
        b: { extends: 'submarine' },
        c: { maxSpeedMps: 1 },
      });
    expect(attempt).toThrow(InvalidArgumentError);
    let message = '';
    try {
      attempt();
    } catch (error) {
      message = (error as Error).message;
    }
    expect(message).toContain('profiles.a.maxSpeedMps');
    expect(message).toContain('profiles.a.gapWarnS');
    expect(message).toContain('profiles.b.extends: unknown profile "submarine"');
    expect(message).toContain('profiles.c.gapWarnS');
  });

  it('rejects unknown keys and inconsistent limits', () => {
    expect(() => parseUserProfiles({ x: { extends: 'diver', maxSpeedKnots: 2 } })).toThrow(
      /profiles\.x: .*maxSpeedKnots/,
    );
    expect(() => parseUserProfiles({ x: { extends: 'diver', gapFailS: 5 } })).toThrow(/profiles\.x\.gapFailS/);
  });

  it('accepts every preset as a complete profile', () => {
    for (const preset of Object.values(PRESET_PROFILES))
      expect(AuditProfileSchema.safeParse(preset).success).toBe(true);
  });
});

describe('resolveAuditProfile', () => {
  it('finds user profiles first, then presets, and lists the valid names otherwise', () => {
    const user = parseUserProfiles({ diver: { extends: 'diver', maxSpeedMps: 0.8 } });
    expect(resolveAuditProfile('diver', user).maxSpeedMps).toBe(0.8);
    expect(resolveAuditProfile('towed-body').name).toBe('towed-body');
    expect(() => resolveAuditProfile('glider')).toThrow(
      /unknown profile "glider" \(valid: inspection-rov, work-rov, diver, towed-body\)/,
    );
  });
});

describe('parseAuditSetup', () => {
  it('accepts the audit setup keys and names a bad one', () => {
    expect(
      parseAuditSetup({ surfaceStationary: true, transceiverDraftM: 1.2, uncertainty: { gnssHorizontal95M: 0.05 } }),
    ).toEqual({
      surfaceStationary: true,
      transceiverDraftM: 1.2,
      uncertainty: { gnssHorizontal95M: 0.05 },
    });
    expect(() => parseAuditSetup({ transceiverDraftM: -1 })).toThrow(/transceiverDraftM/);
    expect(() => parseAuditSetup({ draft: 1 })).toThrow(/draft/);
  });
});
