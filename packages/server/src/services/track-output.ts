import {
  chooseUtmZone,
  GEOJSON_MEDIA_TYPE,
  KML_MEDIA_TYPE,
  LeadlineError,
  resolveCrs,
  type WriteInput,
  writeCsv,
  writeGeoJson,
  writeGpx,
  writeKml,
} from '@leadline/core';
import { AppError } from '../http/errors.js';

/** Track formats the server writes. */
export const TRACK_FORMATS = ['gpx', 'geojson', 'csv', 'kml'] as const;
/** One track format. */
export type TrackFormat = (typeof TRACK_FORMATS)[number];

const MEDIA_TYPES: Record<TrackFormat, string> = {
  gpx: 'application/gpx+xml',
  geojson: GEOJSON_MEDIA_TYPE,
  csv: 'text/csv; charset=utf-8',
  kml: KML_MEDIA_TYPE,
};

/** A rendered file: its text, media type and the CRS note when one was applied. */
export interface RenderedTrack {
  text: string;
  contentType: string;
  extension: TrackFormat;
  crsNote: string | undefined;
}

function refuseCrsOutsideCsv(format: TrackFormat, crs: string | undefined): void {
  if (crs !== undefined && format !== 'csv')
    throw new AppError(
      'unprocessable',
      `A CRS applies to CSV only; GPX, GeoJSON and KML are WGS 84 by their standards (asked for ${crs} with ${format}).`,
      { field: 'crs' },
    );
}

/**
 * Checks a requested output CRS before any work starts (a zip cannot report an error once it
 * streams): none, `utm` (the zone is chosen per track from its data) or an EPSG code proj4 can run,
 * and only with CSV. Throws 422 `AppError` naming the field otherwise.
 */
export function checkOutputCrs(format: TrackFormat, crs: string | undefined): void {
  refuseCrsOutsideCsv(format, crs);
  if (crs === undefined || crs.toLowerCase() === 'utm') return;
  try {
    resolveCrs(crs);
  } catch (error) {
    if (error instanceof LeadlineError) throw new AppError('unprocessable', error.message, { field: 'crs' });
    throw error;
  }
}

/**
 * Writes tracks and waypoints in a format. `crs` (an EPSG code or `utm`) adds projected columns
 * to CSV; GPX, GeoJSON and KML are WGS 84 by their standards, so a CRS with them is refused (422).
 */
export function renderTracks(
  input: WriteInput,
  options: { format: TrackFormat; crs?: string | undefined; name: string; nowMs: number },
): RenderedTrack {
  const base = { contentType: MEDIA_TYPES[options.format], extension: options.format, crsNote: undefined };
  refuseCrsOutsideCsv(options.format, options.crs);
  switch (options.format) {
    case 'gpx':
      return { ...base, text: writeGpx(input, { name: options.name, timeMs: options.nowMs }) };
    case 'geojson':
      return { ...base, text: writeGeoJson(input) };
    case 'kml':
      return { ...base, text: writeKml(input, { name: options.name }) };
    case 'csv': {
      if (options.crs === undefined) return { ...base, text: writeCsv(input) };
      try {
        let code = options.crs;
        let note = '';
        if (code.toLowerCase() === 'utm') {
          const lat = input.tracks.flatMap((t) => Array.from(t.columns.latDeg));
          const lon = input.tracks.flatMap((t) => Array.from(t.columns.lonDeg));
          const choice = chooseUtmZone(lat, lon);
          code = choice.code;
          note = `${choice.note}; `;
        }
        const crs = resolveCrs(code);
        return { ...base, text: writeCsv(input, { crs }), crsNote: `${note}${crs.note}` };
      } catch (error) {
        if (error instanceof LeadlineError) throw new AppError('unprocessable', error.message, { field: 'crs' });
        throw error;
      }
    }
  }
}

/** `attachment` with an ASCII fallback and the UTF-8 name (RFC 6266, RFC 5987). */
export function attachment(fileName: string): string {
  const ascii = fileName.replace(/[^\x20-\x7e]|["\\]/g, '_');
  return `attachment; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(fileName)}`;
}

/** A log's file name without its extension, safe for a download name. */
export function baseName(fileName: string): string {
  const withoutExtension = fileName.replace(/\.[^./\\]{1,8}$/, '');
  const safe = withoutExtension.replace(/[\\/:*?"<>|\s]+/g, '_').replace(/^_+|_+$/g, '');
  return safe === '' ? 'log' : safe;
}
