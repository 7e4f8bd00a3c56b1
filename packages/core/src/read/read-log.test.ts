import { describe, expect, it } from 'vitest';
import { InvalidArgumentError } from '../errors.js';
import { getFix } from '../model/track.js';
import { readCsvEvents } from './read-csv.js';
import { readGpxEvents } from './read-gpx.js';
import { detectFormat, readLog, readLogAndValidate } from './read-log.js';
import { computeNmeaChecksum } from './read-nmea.js';

const fixes = (r: ReturnType<typeof readLog>) => r.tracks.reduce((n, t) => n + t.length, 0);
const accounted = (r: ReturnType<typeof readLog>) =>
  fixes(r) + r.waypoints.length + r.rejections.length + r.nonFixRowCount;

describe('detectFormat', () => {
  it('looks at the content, not the extension', () => {
    expect(detectFormat({ fileName: 'a.txt', content: '<?xml version="1.0"?>\n<gpx version="1.1">' })).toBe('gpx');
    expect(detectFormat({ fileName: 'a.gpx', content: '<kml xmlns="http://www.opengis.net/kml/2.2">' })).toBe('kml');
    expect(detectFormat({ fileName: 'a.csv', content: '$GPHDT,274.07,T*03\n$GPHDT,274.07,T*03\n' })).toBe('nmea');
    expect(detectFormat({ fileName: 'a.json', content: '{"type":"FeatureCollection","features":[]}' })).toBe('geojson');
    expect(detectFormat({ fileName: 'a.gpx', content: 'time;lat;lon\n' })).toBe('csv');
    expect(detectFormat({ fileName: 'a.csv', content: '' })).toBeUndefined();
    expect(detectFormat({ fileName: 'a.bin', content: new Uint8Array([0, 1, 2, 3, 0, 0]) })).toBeUndefined();
  });
});

describe('readLog', () => {
  it('lets an explicit format override detection', () => {
    const r = readLog(
      { fileName: 'a.gpx', content: 'time_utc,lat,lon\n2026-06-01T10:00:00Z,59.1,5.2\n' },
      { format: 'csv' },
    );
    expect(r.format).toBe('csv');
    expect(r.tracks[0]?.length).toBe(1);
  });

  it('reads a CSV longer than the detection sample completely, through both the fast and the general path', () => {
    const lines = ['time_utc,lat,lon,depth_m'];
    for (let i = 0; i < 10_000; i++) {
      const t = new Date(Date.UTC(2026, 5, 1) + i * 1000).toISOString();
      // every 1000th row has a unit in the depth cell: the general path reads it
      lines.push(`${t},${(59 + i * 1e-6).toFixed(6)},5.2,${i % 1000 === 0 ? '3 ft' : '10.5'}`);
    }
    const r = readLog({ fileName: 'long.csv', content: lines.join('\n') });
    const track = r.tracks[0];
    expect(track?.length).toBe(10_000);
    if (track === undefined) return;
    expect(getFix(track, 0).depthM).toBeCloseTo(0.9144, 10); // 3 ft = 0.9144 m (exact international foot)
    expect(getFix(track, 1).depthM).toBe(10.5);
    expect(getFix(track, 9999).latDeg).toBeCloseTo(59.009999, 9);
    for (let i = 1; i < track.length; i++) expect(track.sourceLines[i]).toBe(i + 2);
  });

  it('fills surface columns of the vehicle track from surface_lat/surface_lon columns', () => {
    const r = readLog({
      fileName: 'dive-07.csv',
      content:
        'time_utc,lat,lon,surface_lat,surface_lon,surface_heading_deg\n2026-06-01T10:00:00Z,59.1201,5.2102,59.12,5.21,-10\n',
    });
    expect(r.tracks.map((t) => t.role)).toEqual(['vehicle']);
    expect(r.tracks[0] && getFix(r.tracks[0], 0)).toMatchObject({
      surfaceLatDeg: 59.12,
      surfaceLonDeg: 5.21,
      surfaceHeadingDeg: 350,
    });
  });

  it('throws for caller mistakes only: an unknown zone, CRS or column', () => {
    const content = 'time,easting,northing\n2026-06-01T10:00:00Z,500000,5538630.7\n';
    expect(() => readLog({ fileName: 'a.csv', content }, { timeZone: 'Nowhere/Special' })).toThrow(
      InvalidArgumentError,
    );
    expect(() => readLog({ fileName: 'a.csv', content }, { inputCrs: 'EPSG:999999' })).toThrow(InvalidArgumentError);
    expect(() => readLog({ fileName: 'a.csv', content }, { columns: { latDeg: 'Breite' } })).toThrow(/names no column/);
  });

  it('reads projected easting/northing as cs2cs does', () => {
    // PROJ cs2cs: `echo 300000 6550000 | cs2cs -f %.8f EPSG:25832 EPSG:4326` -> 59.04245428 5.51354745
    const r = readLog(
      { fileName: 'utm.csv', content: 'time_utc,easting_m,northing_m\n2026-06-01T10:00:00Z,300000,6550000\n' },
      { inputCrs: 'EPSG:25832' },
    );
    const fix = r.tracks[0] && getFix(r.tracks[0], 0);
    expect(fix?.latDeg).toBeCloseTo(59.04245428, 7);
    expect(fix?.lonDeg).toBeCloseTo(5.51354745, 7);
    expect(r.tracks[0]?.provenance.inputCrs).toBe('EPSG:25832');
  });
});

describe('readLog (hostile input)', () => {
  it('refuses a 200 MB line without a newline in bounded time, keeping the rows around it', () => {
    const huge = 'x'.repeat(200 * 1024 * 1024);
    const content = `time_utc,lat,lon\n2026-06-01T10:00:00Z,59.1,5.2\n${huge}\n2026-06-01T10:00:01Z,59.1,5.2\n`;
    const r = readLog({ fileName: 'long-line.csv', content }, { format: 'csv' });
    expect(r.rejections).toEqual([
      {
        file: 'long-line.csv',
        line: 3,
        code: 'line-too-long',
        expected: 'a line of at most 65536 characters',
        found: `${huge.length} characters`,
      },
    ]);
    expect(fixes(r)).toBe(2);
    const nmea = readLog({ fileName: 'long-line.nmea', content: `${huge}` }, { format: 'nmea' });
    expect(nmea.rejections.map((x) => x.code)).toEqual(['line-too-long']);
  });

  it('reads UTF-16 without a byte-order mark', () => {
    const text = 'time_utc,lat,lon\n2026-06-01T10:00:00Z,59.1,5.2\n';
    const bytes = new Uint8Array(text.length * 2);
    for (let i = 0; i < text.length; i++) bytes[2 * i] = text.charCodeAt(i);
    const r = readLog({ fileName: 'utf16.csv', content: bytes });
    expect(r.notes).toContain('decoded as UTF-16LE');
    expect(fixes(r)).toBe(1);
  });

  it('refuses binary garbage and empty input with one whole-file rejection', () => {
    const garbage = new Uint8Array(4096);
    for (let i = 0; i < garbage.length; i++) garbage[i] = (i * 131 + 7) % 256;
    for (const [content, code] of [
      [garbage, 'binary-content'],
      [new Uint8Array(0), 'empty-file'],
      ['', 'empty-file'],
    ] as const) {
      const r = readLog({ fileName: 'x.dat', content });
      expect(r.rejections.map((x) => x.code)).toEqual([code]);
      expect(r.rowCount).toBe(accounted(r));
    }
  });

  it('never expands entities: billion laughs and external entities are refused before parsing', async () => {
    const laughs = `<?xml version="1.0"?><!DOCTYPE gpx [<!ENTITY a "aaaaaaaaaa">${Array.from({ length: 20 }, (_, i) => `<!ENTITY b${i} "${'&a;'.repeat(10)}">`).join('')}]><gpx version="1.1"><trk><name>&b19;</name></trk></gpx>`;
    for (const content of [
      laughs,
      '<?xml version="1.0"?><!DOCTYPE gpx SYSTEM "http://example.invalid/x.dtd"><gpx version="1.1"/>',
    ]) {
      for (const format of ['gpx', 'kml'] as const) {
        const r = await readLogAndValidate({ fileName: `evil.${format}`, content }, { format });
        expect(r.rejections.map((x) => x.code)).toEqual(['forbidden-xml-construct']);
        expect(r.notes.join(' ')).not.toMatch(/schema/);
      }
    }
  });

  it('streams a GPX: fixes come out before the whole text has been produced', () => {
    let produced = 0;
    function* chunks(): Generator<string> {
      yield '<?xml version="1.0"?><gpx version="1.1" xmlns="http://www.topografix.com/GPX/1/1"><trk><trkseg>\n';
      for (let c = 0; c < 200; c++) {
        let part = '';
        for (let i = 0; i < 500; i++) part += `<trkpt lat="59.1" lon="5.2"><time>2026-06-01T10:00:00Z</time></trkpt>\n`;
        produced++;
        yield part.repeat(5); // ~1.5 MB per chunk, 500 k points in all
      }
      yield '</trkseg></trk></gpx>';
    }
    let firstFixAt = -1;
    let count = 0;
    for (const event of readGpxEvents({ fileName: 'big.gpx', chunks: chunks() })) {
      // fixes come one by one or in batches
      const fixes = event.kind === 'fix' ? 1 : event.kind === 'fix-batch' ? event.batch.count : 0;
      if (fixes === 0) continue;
      if (firstFixAt < 0) firstFixAt = produced;
      count += fixes;
      if (count >= 10_000) break; // enough to show it streams; the benchmark reads millions
    }
    expect(firstFixAt).toBeGreaterThan(0);
    expect(firstFixAt).toBeLessThan(5);
  });

  it('streams a CSV given in chunks with lines split across them', () => {
    const text = 'time_utc,lat,lon\r\n2026-06-01T10:00:00Z,59.1,5.2\r\n2026-06-01T10:00:01Z,59.2,5.3\r\n';
    const chunks = text.match(/[\s\S]{1,7}/g) ?? [];
    let count = 0;
    let rejections = 0;
    // a batch is only valid until the next event is asked for: count while iterating
    for (const e of readCsvEvents({ fileName: 'chunks.csv', chunks })) {
      count += e.kind === 'fix' ? 1 : e.kind === 'fix-batch' ? e.batch.count : 0;
      if (e.kind === 'rejection') rejections++;
    }
    expect(count).toBe(2);
    expect(rejections).toBe(0);
  });

  it('rejects out-of-range coordinates, NaN/Infinity and years 1900 and 2200 row by row', () => {
    const r = readLog({
      fileName: 'bad.csv',
      content: [
        'time_utc,lat,lon',
        '2026-06-01T10:00:00Z,-90.5,5.2',
        '2026-06-01T10:00:01Z,59.1,181',
        '2026-06-01T10:00:02Z,nan,5.2',
        '2026-06-01T10:00:03Z,59.1,-inf',
        '1900-01-01T00:00:00Z,59.1,5.2',
        '2200-01-01T00:00:00Z,59.1,5.2',
        '2026-06-01T10:00:06Z,59.1,5.2',
      ].join('\n'),
    });
    expect(r.rejections.map((x) => [x.line, x.code])).toEqual([
      [2, 'latitude-out-of-range'],
      [3, 'longitude-out-of-range'],
      [4, 'non-finite-value'],
      [5, 'non-finite-value'],
      [6, 'time-out-of-range'],
      [7, 'time-out-of-range'],
    ]);
    expect(fixes(r)).toBe(1);
    expect(r.rowCount).toBe(accounted(r));
  });
});

describe('readLogAndValidate', () => {
  it('reports schema problems with line numbers and keeps the usable data', async () => {
    const gpx = `<?xml version="1.0"?>
<gpx version="1.1" creator="t" xmlns="http://www.topografix.com/GPX/1/1">
<trk><trkseg><trkpt lat="59.1" lon="5.2"><time>2026-06-01T10:00:00Z</time><depth>3</depth></trkpt></trkseg></trk>
</gpx>`;
    const r = await readLogAndValidate({ fileName: 'lenient.gpx', content: gpx });
    // GPX 1.1 XSD: wptType children are a fixed sequence; <depth> is not one of them outside <extensions>.
    expect(r.notes.some((n) => /^schema: line 3: .*depth.*not expected/.test(n))).toBe(true);
    expect(r.tracks[0]?.length).toBe(1);
    expect(r.tracks[0]?.columns.depthM[0]).toBe(3);
  });

  it('says a valid GPX 1.0 and 1.1 is valid', async () => {
    const s = (body: string) => `$${body}*${computeNmeaChecksum(body)}`;
    expect(s('GPHDT,274.07,T')).toBe('$GPHDT,274.07,T*03'); // NMEA Revealed, HDT
    const r = await readLogAndValidate({
      fileName: 'ok.gpx',
      content:
        '<?xml version="1.0"?><gpx version="1.0" creator="t" xmlns="http://www.topografix.com/GPX/1/0"><wpt lat="1" lon="2"/></gpx>',
    });
    expect(r.notes).toContain('schema: valid against the published gpx-1.0 XSD');
  });
});
