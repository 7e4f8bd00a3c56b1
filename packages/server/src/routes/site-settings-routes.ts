import { z } from 'zod';
import { defineRoute, type RouteSpec } from '../http/route-table.js';

/** What the site needs to know about this installation before anyone signs in. */
export interface SiteSettings {
  /** XYZ template of background map tiles ({z}/{x}/{y}); null when none is configured. */
  tileUrl: string | null;
  /** Credit to show over the tiles; null when none is configured. */
  tileAttribution: string | null;
}

const SiteSettingsSchema = z.object({
  tileUrl: z.string().nullable(),
  tileAttribution: z.string().nullable(),
});

/** `GET /site-settings`: installation settings the web site reads (the optional background map). */
export function createSiteSettingsRoutes(settings: SiteSettings): RouteSpec[] {
  return [
    defineRoute({
      method: 'get',
      path: '/site-settings',
      summary: 'Installation settings the web site reads: the optional background map tile template',
      tag: 'Health',
      access: 'public',
      responses: { 200: { description: 'The settings', schema: SiteSettingsSchema } },
      handler(_input, _req, res) {
        res.json(settings);
      },
    }),
  ];
}
