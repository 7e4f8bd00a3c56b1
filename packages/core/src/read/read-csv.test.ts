import { describe, expect, it } from 'vitest';
import { readCsv } from './read-csv.js';

describe('readCsv', () => {
  it('keeps rows and rejections of a projected log in order whichever path read each row', () => {
    // 5000 rows (more than one batch of 4096); row 3 has an easting no CRS can convert (read by the
    // general path: `1e300` is not a plain number), row 4 a time that is no time, row 4500 an empty
    // surface easting beside a northing. Projection failures are found when a batch of 4096 rows
    // waiting for conversion is converted, after the rows read so far were judged.
    const rows = ['time_utc,easting_m,northing_m,surface_easting_m,surface_northing_m,depth_m'];
    for (let i = 0; i < 5000; i++) {
      const time = new Date(Date.UTC(2026, 5, 1, 10) + i * 1000).toISOString();
      const line = i + 2;
      const easting = line === 3 ? '1e300' : (300_000 + i).toFixed(2);
      const surface = line === 4500 ? ',6550010.00' : `${(300_010 + i).toFixed(2)},6550010.00`;
      rows.push(`${line === 4 ? 'not-a-time' : time},${easting},6550000.00,${surface},${(i % 50) / 2}`);
    }
    const r = readCsv({ fileName: 'utm.csv', content: `${rows.join('\n')}\n` }, { inputCrs: 'EPSG:25832' });
    expect(r.rejections.map((x) => [x.line, x.code])).toEqual([
      [4, 'unparsable-time'],
      [3, 'projection-failed'],
      [4500, 'unparsable-number'],
    ]);
    const track = r.tracks[0];
    expect(track?.length).toBe(4997);
    expect(r.rowCount).toBe(5001); // the header is a row too
    // every fix keeps its own line, in order, and a converted position
    const lines = [...(track?.sourceLines ?? [])];
    expect(lines.slice(0, 3)).toEqual([2, 5, 6]);
    expect(lines.every((line, i) => i === 0 || line > (lines[i - 1] as number))).toBe(true);
    for (let i = 0; i < (track?.length ?? 0); i++) {
      // PROJ cs2cs: `echo 300000 6550000 | cs2cs -f %.8f EPSG:25832 EPSG:4326` -> 59.04245428 5.51354745;
      // the rows move 1 m east per second, so every position stays within 0.1 degree of it
      expect(Math.abs((track?.columns.latDeg[i] as number) - 59.04245428)).toBeLessThan(0.1);
      expect(Math.abs((track?.columns.surfaceLonDeg[i] as number) - 5.51354745)).toBeLessThan(0.1);
    }
  });
});
