import { z } from 'zod';
import type { ReprocessRequest } from '../api/reprocess-dive';

/** The audit profiles every project knows (core's presets). */
export const PRESET_PROFILES = ['inspection-rov', 'work-rov', 'diver', 'towed-body'] as const;

/** Text typed into a number field: empty, or a number within the bounds. */
function decimal(what: string, min: number, max: number, unit: string) {
  return z
    .string()
    .trim()
    .refine(
      (text) => text === '' || Number.isFinite(Number(text)),
      `${what}: enter a number, e.g. ${min < 0 ? '-1.5' : '1.5'}.`,
    )
    .refine(
      (text) => text === '' || (Number(text) >= min && Number(text) <= max),
      `${what} must be between ${min} and ${max} ${unit}.`,
    );
}

/**
 * The reprocess form. Number fields hold the typed text (empty = not given); bounds are plausibility
 * limits (common practice), not physics: sound speed in sea and fresh water lies within about
 * 1400–1600 m/s, so 1300–1700 catches a typo without refusing an odd but real value.
 */
export const reprocessFormSchema = z
  .object({
    auditProfile: z.string().regex(/^[a-z][a-z0-9-]{0,63}$/, 'Choose a profile.'),
    resolve: z.boolean(),
    loggedSoundSpeedMps: decimal('The logged sound speed', 1300, 1700, 'm/s'),
    waterMethod: z.enum(['none', 'value', 'temperature-salinity']),
    waterSoundSpeedMps: decimal('The water sound speed', 1300, 1700, 'm/s'),
    temperatureC: decimal('The temperature', 0, 40, '°C'),
    salinityPsu: decimal('The salinity', 0, 40, 'PSU'),
    bearingReference: z.enum(['from-log', 'relative', 'true', 'magnetic']),
    headingOffsetDeg: decimal('The heading offset', -180, 180, '°'),
    declinationMethod: z.enum(['wmm', 'value']),
    declinationDeg: decimal('The declination', -90, 90, '°'),
    leverArmForwardM: decimal('The lever arm forward', -100, 100, 'm'),
    leverArmStarboardM: decimal('The lever arm starboard', -100, 100, 'm'),
    leverArmDownM: decimal('The lever arm down', -100, 100, 'm'),
    transceiverDraftM: decimal('The transceiver draft', 0, 50, 'm'),
    surfaceMethod: z.enum(['gnss', 'fixed']),
    surfaceLatDeg: decimal('The latitude', -90, 90, '°'),
    surfaceLonDeg: decimal('The longitude', -180, 180, '°'),
  })
  .superRefine((v, ctx) => {
    if (!v.resolve) return;
    const need = (path: keyof typeof v, ok: boolean, message: string) => {
      if (!ok) ctx.addIssue({ code: 'custom', path: [path], message });
    };
    need('loggedSoundSpeedMps', v.loggedSoundSpeedMps !== '', 'Enter the sound speed the system logged with.');
    if (v.waterMethod === 'value')
      need(
        'waterSoundSpeedMps',
        v.waterSoundSpeedMps !== '',
        'Enter the sound speed in the water, or choose another way.',
      );
    if (v.waterMethod === 'temperature-salinity') {
      need('temperatureC', v.temperatureC !== '', 'Enter the water temperature.');
      need('salinityPsu', v.salinityPsu !== '', 'Enter the salinity (0 for fresh water).');
    }
    if (v.declinationMethod === 'value')
      need(
        'declinationDeg',
        v.declinationDeg !== '',
        'Enter the declination, or let the World Magnetic Model give it.',
      );
    if (v.surfaceMethod === 'fixed') {
      need('surfaceLatDeg', v.surfaceLatDeg !== '', 'Enter the surveyed latitude.');
      need('surfaceLonDeg', v.surfaceLonDeg !== '', 'Enter the surveyed longitude.');
    }
  });

/** The form's values (all text, so a half-typed number stays as typed). */
export type ReprocessFormValues = z.infer<typeof reprocessFormSchema>;

/** An empty form: the project's profile, no re-solve, every setup value at its default. */
export function defaultReprocessValues(auditProfile: string): ReprocessFormValues {
  return {
    auditProfile,
    resolve: false,
    loggedSoundSpeedMps: '1500',
    waterMethod: 'none',
    waterSoundSpeedMps: '',
    temperatureC: '',
    salinityPsu: '',
    bearingReference: 'from-log',
    headingOffsetDeg: '0',
    declinationMethod: 'value',
    declinationDeg: '0',
    leverArmForwardM: '0',
    leverArmStarboardM: '0',
    leverArmDownM: '0',
    transceiverDraftM: '0',
    surfaceMethod: 'gnss',
    surfaceLatDeg: '',
    surfaceLonDeg: '',
  };
}

const SOURCE = 'entered on the dive page';

function num(text: string): number {
  return text === '' ? 0 : Number(text);
}

/** Turns valid form values into the reprocess request (core's re-solve setup when asked to re-solve). */
export function toReprocessRequest(v: ReprocessFormValues): ReprocessRequest {
  if (!v.resolve) return { auditProfile: v.auditProfile, setup: null };
  const water =
    v.waterMethod === 'value'
      ? { method: 'value', soundSpeedMps: num(v.waterSoundSpeedMps), source: SOURCE }
      : v.waterMethod === 'temperature-salinity'
        ? // UNESCO 1983 (Chen & Millero) holds for 0–40 °C and salinity 0–40, fresh water included.
          { method: 'unesco-1983', temperatureC: num(v.temperatureC), salinityPsu: num(v.salinityPsu), source: SOURCE }
        : undefined;
  return {
    auditProfile: v.auditProfile,
    setup: {
      name: 'set on the dive page',
      soundSpeed: { loggedMps: num(v.loggedSoundSpeedMps), loggedSource: SOURCE, ...(water ? { water } : {}) },
      bearingReference: { value: v.bearingReference, source: SOURCE },
      headingOffset: { valueDeg: num(v.headingOffsetDeg), source: SOURCE },
      declination:
        v.declinationMethod === 'wmm'
          ? { method: 'wmm' }
          : { method: 'value', valueDeg: num(v.declinationDeg), source: SOURCE },
      leverArm: {
        forwardM: num(v.leverArmForwardM),
        starboardM: num(v.leverArmStarboardM),
        downM: num(v.leverArmDownM),
        source: SOURCE,
      },
      transceiverDraft: { valueM: num(v.transceiverDraftM), source: SOURCE },
      surfacePosition:
        v.surfaceMethod === 'fixed'
          ? { method: 'fixed', latDeg: num(v.surfaceLatDeg), lonDeg: num(v.surfaceLonDeg), source: SOURCE }
          : { method: 'gnss' },
    },
  };
}
