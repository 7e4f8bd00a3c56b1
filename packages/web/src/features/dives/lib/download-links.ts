import type { DiveArchiveRef } from '../types';

/** Track formats the server writes. */
export const TRACK_FORMATS = [
  { value: 'gpx', label: 'GPX 1.1' },
  { value: 'geojson', label: 'GeoJSON' },
  { value: 'csv', label: 'CSV' },
  { value: 'kml', label: 'KML 2.2' },
] as const;

/** One of {@link TRACK_FORMATS}. */
export type TrackFormat = (typeof TRACK_FORMATS)[number]['value'];

/** Which positions a download holds. */
export type TrackVariant = 'raw' | 'cleaned' | 'resolved';

/** Report formats the server writes. */
export const REPORT_FORMATS = [
  { value: 'json', label: 'JSON' },
  { value: 'md', label: 'Markdown' },
  { value: 'html', label: 'HTML' },
] as const;

function diveBase(ref: DiveArchiveRef, diveId: string): string {
  return `/api/v1/organisations/${encodeURIComponent(ref.organisationId)}/projects/${encodeURIComponent(ref.projectId)}/dives/${encodeURIComponent(diveId)}`;
}

/** The address of a track download; a CRS only goes with CSV (the other formats are WGS 84 by definition). */
export function trackDownloadUrl(
  ref: DiveArchiveRef,
  diveId: string,
  choice: { format: TrackFormat; variant: TrackVariant; crs?: string },
): string {
  const query = new URLSearchParams({ format: choice.format, variant: choice.variant });
  if (choice.format === 'csv' && choice.crs !== undefined && choice.crs.trim() !== '')
    query.set('crs', choice.crs.trim());
  return `${diveBase(ref, diveId)}/track?${query}`;
}

/** The address of an audit report (the latest run's unless a result is named). */
export function reportDownloadUrl(ref: DiveArchiveRef, diveId: string, format: string, resultId?: string): string {
  const query = new URLSearchParams({ format });
  if (resultId !== undefined) query.set('resultId', resultId);
  return `${diveBase(ref, diveId)}/report?${query}`;
}

/** The address of the original uploaded file, byte for byte. */
export function originalDownloadUrl(ref: DiveArchiveRef): string {
  return `/api/v1/organisations/${encodeURIComponent(ref.organisationId)}/projects/${encodeURIComponent(ref.projectId)}/logs/${encodeURIComponent(ref.logId)}/original`;
}

/** The file name in a `Content-Disposition` header (RFC 6266: `filename*` first), or undefined. */
export function fileNameFromDisposition(header: string | null): string | undefined {
  if (header === null) return undefined;
  const extended = /filename\*=UTF-8''([^;]+)/i.exec(header);
  if (extended?.[1] !== undefined) {
    try {
      return decodeURIComponent(extended[1]);
    } catch {
      // Fall through to the plain name.
    }
  }
  return /filename="([^"]*)"/i.exec(header)?.[1];
}
