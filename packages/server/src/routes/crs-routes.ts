import { z } from 'zod';
import { defineRoute, type RouteSpec } from '../http/route-table.js';
import { lookUpCrs } from '../services/crs-service.js';

const PositionSchema = z
  .string()
  .regex(/^\s*-?\d+(\.\d+)?\s*,\s*-?\d+(\.\d+)?\s*$/, 'latitude,longitude in WGS 84 degrees, e.g. 56.12,3.48')
  .transform((text) => text.split(',').map(Number) as [number, number])
  .refine(
    ([lat, lon]) => lat >= -90 && lat <= 90 && lon >= -180 && lon <= 180,
    'latitude within ±90°, longitude within ±180°',
  );

const CrsQuery = z
  .object({
    q: z
      .string()
      .trim()
      .min(1, 'type at least one character')
      .max(100)
      .optional()
      .describe('Words of the name, or an EPSG code (25832 or EPSG:25832)'),
    at: PositionSchema.optional().describe('latitude,longitude: the CRSs whose area of use covers this position'),
    limit: z.coerce.number().int().min(1).max(50).default(20),
  })
  .refine((query) => (query.q === undefined) !== (query.at === undefined), {
    message: 'Give exactly one of q (words or a code) and at (latitude,longitude).',
    path: ['q'],
  });

const CrsListingSchema = z.object({
  code: z.string().describe('EPSG:<number>'),
  name: z.string(),
  kind: z.enum(['geographic', 'projected']),
  areaOfUse: z
    .object({ west: z.number(), south: z.number(), east: z.number(), north: z.number(), description: z.string() })
    .nullable()
    .describe('Degrees; west > east crosses the antimeridian'),
  accuracyM: z.number().nullable().describe('Accuracy of the datum step to WGS 84 in metres, when stated'),
});

/** `GET /crs`: the EPSG registry for the web's CRS pickers (the index loads only on the server). */
export function createCrsRoutes(): RouteSpec[] {
  return [
    defineRoute({
      method: 'get',
      path: '/crs',
      summary: 'Geographic and projected CRSs by name words or EPSG code, or those whose area of use covers a position',
      tag: 'CRS',
      access: 'signed-in',
      query: CrsQuery,
      responses: {
        200: { description: 'Matches, best first', schema: z.object({ crs: z.array(CrsListingSchema) }) },
      },
      handler({ query }, _req, res) {
        const listings =
          query.at === undefined
            ? lookUpCrs({ q: query.q ?? '', limit: query.limit })
            : lookUpCrs({ latDeg: query.at[0], lonDeg: query.at[1], limit: query.limit });
        res.json({
          crs: listings.map((l) => ({ ...l, areaOfUse: l.areaOfUse ?? null, accuracyM: l.accuracyM ?? null })),
        });
      },
    }),
  ];
}
