import { describe, expect, it } from 'vitest';
import { fileNameFromDisposition, trackDownloadUrl } from './download-links';

const ref = { organisationId: 'o', projectId: 'p', logId: 'l', resultId: 'r', logFileName: 'x.csv' };

describe('trackDownloadUrl', () => {
  it('sends a CRS with CSV only', () => {
    expect(trackDownloadUrl(ref, 'd', { format: 'csv', variant: 'raw', crs: 'EPSG:25832' })).toBe(
      '/api/v1/organisations/o/projects/p/dives/d/track?format=csv&variant=raw&crs=EPSG%3A25832',
    );
    expect(trackDownloadUrl(ref, 'd', { format: 'gpx', variant: 'cleaned', crs: 'EPSG:25832' })).toBe(
      '/api/v1/organisations/o/projects/p/dives/d/track?format=gpx&variant=cleaned',
    );
  });
});

describe('fileNameFromDisposition', () => {
  it('prefers the UTF-8 name (RFC 6266) and falls back to the quoted one', () => {
    expect(fileNameFromDisposition(`attachment; filename="a_b.gpx"; filename*=UTF-8''a%C3%B8b.gpx`)).toBe('aøb.gpx');
    expect(fileNameFromDisposition('attachment; filename="dive-01.csv"')).toBe('dive-01.csv');
    expect(fileNameFromDisposition(null)).toBeUndefined();
  });
});
