import { z } from 'zod';

const severity = z.enum(['info', 'warn', 'fail']);
const verdict = z.enum(['pass', 'warn', 'fail']);
const isoTime = z.iso.datetime().nullable();
const counts = z.strictObject({
  info: z.number().int().nonnegative(),
  warn: z.number().int().nonnegative(),
  fail: z.number().int().nonnegative(),
});
const position = z.strictObject({ latDeg: z.number(), lonDeg: z.number() }).nullable();

/** The JSON schema of a dive report (`leadline/dive-report@1`) as a zod schema; report/README.md documents each field. */
export const DiveReportSchema = z.strictObject({
  schema: z.literal('leadline/dive-report@1'),
  leadlineVersion: z.string(),
  file: z.string(),
  trackId: z.string(),
  profile: z.string(),
  verdict,
  verdictRule: z.string(),
  fixCount: z.number().int().nonnegative(),
  flaggedCount: z.number().int().nonnegative(),
  flaggedShare: z.number().min(0).max(1),
  findingCounts: counts,
  findings: z.array(
    z.strictObject({
      check: z.string(),
      severity,
      startIndex: z.number().int().nonnegative(),
      endIndex: z.number().int().nonnegative(),
      startTime: isoTime,
      endTime: isoTime,
      measured: z.number().nullable(),
      limit: z.number().nullable(),
      unit: z.string(),
      message: z.string().min(1),
    }),
  ),
  summary: z.looseObject({
    startTime: isoTime,
    endTime: isoTime,
    durationS: z.number().nullable(),
    fixCount: z.number().int(),
    distanceM: z.number(),
    maxDepthM: z.number().nullable(),
    bboxDeg: z.tuple([z.number(), z.number(), z.number(), z.number()]).nullable(),
    startPosition: position,
    endPosition: position,
    centroid: position,
  }),
  horizontalUncertainty95M: z.strictObject({
    median: z.number().nullable(),
    p95: z.number().nullable(),
    max: z.number().nullable(),
  }),
  s44: z.array(
    z.strictObject({
      order: z.enum(['exclusive', 'special', '1a', '1b', '2']),
      judged: z.number().int().nonnegative(),
      meeting: z.number().int().nonnegative(),
      share: z.number().min(0).max(1).nullable(),
    }),
  ),
  caution: z.string().min(1),
});

/** The JSON schema of a batch report (`leadline/batch-report@1`) as a zod schema. */
export const BatchReportSchema = z.strictObject({
  schema: z.literal('leadline/batch-report@1'),
  leadlineVersion: z.string(),
  generatedAt: isoTime,
  profile: z.string(),
  verdict,
  verdictRule: z.string(),
  verdictCounts: z.strictObject({ pass: z.number().int(), warn: z.number().int(), fail: z.number().int() }),
  fixCount: z.number().int().nonnegative(),
  flaggedCount: z.number().int().nonnegative(),
  dives: z.array(
    z.strictObject({
      file: z.string(),
      trackId: z.string(),
      verdict,
      fixCount: z.number().int().nonnegative(),
      flaggedCount: z.number().int().nonnegative(),
      findingCounts: counts,
      startTime: isoTime,
      durationS: z.number().nullable(),
      href: z.string().optional(),
    }),
  ),
  caution: z.string().min(1),
});
