import { z } from 'zod';
import { InvalidArgumentError } from '../errors.js';

/** What a setup parameter's value rests on; defaults to `not stated` so every output says so. */
const source = z.string().min(1).default('not stated');

const finite = z.number().finite();

const soundSpeedSampleSchema = z.strictObject({ depthM: finite.min(0), soundSpeedMps: finite.positive() });

/** How the true speed of sound in the water is known. */
const waterSoundSpeedSchema = z.discriminatedUnion('method', [
  z.strictObject({ method: z.literal('value'), soundSpeedMps: finite.positive(), source }),
  z.strictObject({
    method: z.literal('mackenzie-1981'),
    temperatureC: finite,
    salinityPsu: finite.min(0),
    source,
  }),
  z.strictObject({
    method: z.literal('unesco-1983'),
    temperatureC: finite,
    salinityPsu: finite.min(0),
    temperatureScale: z.enum(['its90', 'ipts68']).default('its90'),
    source,
  }),
  z.strictObject({ method: z.literal('fresh-marczak-1997'), temperatureC: finite, source }),
  z.strictObject({ method: z.literal('fresh-bilaniuk-wong-1993'), temperatureC: finite, source }),
  z.strictObject({
    method: z.literal('profile'),
    samples: z
      .array(soundSpeedSampleSchema)
      .min(1)
      .refine((samples) => samples.every((s, i) => i === 0 || s.depthM > (samples[i - 1]?.depthM ?? -1)), {
        message: 'profile depths must increase',
      }),
    source,
  }),
]);

/**
 * The re-solve setup: every parameter that turns raw acoustic observations into vehicle
 * positions, each with the source it rests on. Parsed and defaulted by {@link parseResolveSetup};
 * the parsed object travels with the re-solved track.
 */
export const resolveSetupSchema = z.strictObject({
  /** A short name for reports, e.g. `after CTD cast`. */
  name: z.string().default('re-solve setup'),
  /** How ranges were observed: logged slant ranges (at the logged sound speed) or one-way travel times. */
  rangeObservation: z
    .strictObject({ kind: z.enum(['slant-range', 'one-way-travel-time']).default('slant-range'), source })
    .default({ kind: 'slant-range', source: 'not stated' }),
  soundSpeed: z.strictObject({
    /** The speed the system used to turn travel times into the logged slant ranges, m/s. */
    loggedMps: finite.positive(),
    loggedSource: source,
    /** The true speed in the water; left out, ranges are not rescaled. */
    water: waterSoundSpeedSchema.optional(),
  }),
  /** What logged bearings are measured from; `from-log` uses the log's own statement. */
  bearingReference: z
    .strictObject({ value: z.enum(['from-log', 'relative', 'true', 'magnetic']).default('from-log'), source })
    .default({ value: 'from-log', source: 'not stated' }),
  /** Heading sensor installation (misalignment) offset added to the logged heading, degrees clockwise. */
  headingOffset: z.strictObject({ valueDeg: finite, source }).default({ valueDeg: 0, source: 'not stated' }),
  /** Magnetic declination added to the logged heading: from the World Magnetic Model or a number (0 for a true heading). */
  declination: z
    .discriminatedUnion('method', [
      z.strictObject({ method: z.literal('wmm'), source: z.string().min(1).default('World Magnetic Model') }),
      z.strictObject({ method: z.literal('value'), valueDeg: finite, source }),
    ])
    .default({ method: 'value', valueDeg: 0, source: 'not stated' }),
  /**
   * GNSS antenna to transceiver, metres in the surface unit's frame (forward, starboard, down).
   * `downM` is recorded but does not enter the geometry: the transceiver's depth is the draft.
   */
  leverArm: z
    .strictObject({ forwardM: finite, starboardM: finite, downM: finite.default(0), source })
    .default({ forwardM: 0, starboardM: 0, downM: 0, source: 'not stated' }),
  /** Transceiver depth below the water surface, metres. */
  transceiverDraft: z.strictObject({ valueM: finite.min(0), source }).default({ valueM: 0, source: 'not stated' }),
  /** Where the surface unit was: its logged GNSS fixes, or a surveyed fixed position (and optionally a fixed true heading). */
  surfacePosition: z
    .discriminatedUnion('method', [
      z.strictObject({ method: z.literal('gnss'), source: z.string().min(1).default('logged GNSS fixes') }),
      z.strictObject({
        method: z.literal('fixed'),
        latDeg: finite.min(-90).max(90),
        lonDeg: finite.min(-180).max(180),
        /** True heading of the surface unit's frame; when given, the logged heading, offset and declination are not used. */
        headingTrueDeg: finite.optional(),
        source,
      }),
    ])
    .default({ method: 'gnss', source: 'logged GNSS fixes' }),
  /**
   * What the system applied when it logged true or magnetic bearings, so they can be taken back
   * to relative ones before the corrected values are applied. Unused for relative bearings.
   */
  loggedWith: z
    .strictObject({ headingOffsetDeg: finite.default(0), declinationDeg: finite.default(0), source })
    .default({ headingOffsetDeg: 0, declinationDeg: 0, source: 'not stated' }),
});

/** A parsed re-solve setup with every default filled in (see {@link resolveSetupSchema}). */
export type ResolveSetup = z.output<typeof resolveSetupSchema>;
/** A re-solve setup as written in a config file or request, before defaults. */
export type ResolveSetupInput = z.input<typeof resolveSetupSchema>;
/** How the true speed of sound in the water is given. */
export type WaterSoundSpeed = NonNullable<ResolveSetup['soundSpeed']['water']>;

/**
 * The setup's JSON Schema (draft 2020-12, input side: defaults shown, optional keys optional), for
 * API documents and editors. Generated from {@link resolveSetupSchema}, so the two never disagree.
 */
export function resolveSetupJsonSchema(): Record<string, unknown> {
  return z.toJSONSchema(resolveSetupSchema, { io: 'input' }) as Record<string, unknown>;
}

/**
 * Validates a re-solve setup (plain JSON) and fills its defaults. Throws `InvalidArgumentError`
 * whose message names every bad key (e.g. `soundSpeed.loggedMps: expected number`).
 */
export function parseResolveSetup(input: unknown): ResolveSetup {
  const parsed = resolveSetupSchema.safeParse(input);
  if (parsed.success) return parsed.data;
  const problems = parsed.error.issues.map((issue) => `${issue.path.join('.') || '(setup)'}: ${issue.message}`);
  throw new InvalidArgumentError(`invalid re-solve setup: ${problems.join('; ')}`);
}
