import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { simulateDive } from './simulate-dive.js';
import { planSeason } from './simulate-season.js';
import { LOG_DIALECTS, writeDiveLogs } from './write-dive-logs.js';

// One short Skarvholmen dive (zone 32V exception) and one short Greywhistle dive (southern hemisphere).
const plans = planSeason({ seed: 5, dives: 40, diveMinutes: 6 });
const northPlan = plans.find((p) => p.spec.site.id === 'skarvholmen');
const southPlan = plans.find((p) => p.spec.site.id === 'greywhistle');
if (northPlan === undefined || southPlan === undefined) throw new Error('the season lacks a site');
const north = simulateDive(northPlan.spec);
const south = simulateDive(southPlan.spec);
const GPX_XSD = fileURLToPath(new URL('../read/schemas/gpx-1.1.xsd', import.meta.url));

function rows(text: string, separator = ','): string[][] {
  return text
    .replace(/^\uFEFF/, '')
    .split(/\r?\n/)
    .filter((line) => line.length > 0)
    .slice(1)
    .map((line) => line.split(separator));
}

// Independent readers for the test: DDM / DMS with hemisphere letters back to signed degrees.
function fromDdm(text: string): number {
  const m = /^(\d+)°(\d+\.\d+)'([NSEW])$/.exec(text);
  if (m === null) throw new Error(`not DDM: ${text}`);
  const value = Number(m[1]) + Number(m[2]) / 60;
  return m[3] === 'S' || m[3] === 'W' ? -value : value;
}

function fromDms(text: string): number {
  const m = /^"(\d+)°(\d+)'(\d+\.\d+)""([NSEW])"$/.exec(text);
  if (m === null) throw new Error(`not DMS: ${text}`);
  const value = Number(m[1]) + Number(m[2]) / 60 + Number(m[3]) / 3600;
  return m[4] === 'S' || m[4] === 'W' ? -value : value;
}

describe('writeDiveLogs', () => {
  it('writes one row per logged vehicle fix and per surface epoch in every CSV dialect', () => {
    for (const dialect of LOG_DIALECTS.filter((d) => d.startsWith('csv'))) {
      const [vehicle, surface] = writeDiveLogs(south, dialect);
      const separator = dialect === 'csv-semicolon-decimal-comma' ? ';' : ',';
      expect(vehicle?.name).toMatch(/^greywhistle\/\d{4}-\d{2}-\d{2}_\d{4}_HT-\d{3}_vehicle\.csv$/);
      expect(rows(vehicle?.text ?? '', separator).length).toBe(south.vehicleLog.length);
      expect(rows(surface?.text ?? '', separator).length).toBe(south.surfaceLog.length);
    }
  });

  it('writes the same positions in decimal degrees, decimal comma, DDM and DMS with hemisphere letters', () => {
    const plain = rows(writeDiveLogs(south, 'csv')[0]?.text ?? '');
    const comma = rows(writeDiveLogs(south, 'csv-semicolon-decimal-comma')[0]?.text ?? '', ';');
    const ddm = rows(writeDiveLogs(south, 'csv-ddm')[0]?.text ?? '');
    const dmsText = writeDiveLogs(south, 'csv-dms')[0]?.text ?? '';
    // DMS fields are quoted and hold commas nowhere, so a plain split keeps them whole.
    const dms = rows(dmsText);
    for (let i = 0; i < plain.length; i += 17) {
      const lat = Number(plain[i]?.[1]);
      const lon = Number(plain[i]?.[2]);
      expect(lat).toBeLessThan(0);
      expect(Number(comma[i]?.[1]?.replace(',', '.'))).toBe(lat);
      expect(fromDdm(ddm[i]?.[1] ?? '')).toBeCloseTo(lat, 6);
      expect(fromDdm(ddm[i]?.[2] ?? '')).toBeCloseTo(lon, 6);
      expect(fromDms(dms[i]?.[1] ?? '')).toBeCloseTo(lat, 6);
      expect(fromDms(dms[i]?.[2] ?? '')).toBeCloseTo(lon, 6);
    }
    expect(ddm[0]?.[1]).toMatch(/S$/);
    expect(dms[0]?.[2]).toMatch(/E"$/);
  });

  it('writes epoch ms, separate date/time columns and CRLF with a BOM for the same instants', () => {
    const iso = rows(writeDiveLogs(north, 'csv')[0]?.text ?? '').map((r) => r[0]);
    const epoch = rows(writeDiveLogs(north, 'csv-epoch-ms')[0]?.text ?? '').map((r) => Number(r[0]));
    const split = rows(writeDiveLogs(north, 'csv-date-time')[0]?.text ?? '').map((r) => `${r[0]}T${r[1]}Z`);
    expect(epoch.map((ms) => new Date(ms).toISOString())).toEqual(iso);
    expect(split).toEqual(iso);
    const crlf = writeDiveLogs(north, 'csv-crlf-bom')[0]?.text ?? '';
    expect(crlf.startsWith('\uFEFFtime_utc,')).toBe(true);
    expect(crlf.split('\r\n').length - 1).toBe(north.vehicleLog.length + 1);
    expect(crlf.replace(/\r\n/g, '')).not.toMatch(/[\r\n]/);
  });

  it('writes easting/northing in the site CRS as PROJ cs2cs computes them (EPSG:25832, zone 32 by the 32V exception)', () => {
    const [vehicle] = writeDiveLogs(north, 'csv-projected');
    expect(vehicle?.crs).toBe('EPSG:25832');
    const projected = rows(vehicle?.text ?? '');
    const plain = rows(writeDiveLogs(north, 'csv')[0]?.text ?? '');
    const picks = [0, Math.floor(plain.length / 2), plain.length - 1];
    // Reference: PROJ's cs2cs (EPSG:4326 takes latitude first), an external tool.
    const input = picks.map((i) => `${plain[i]?.[1]} ${plain[i]?.[2]}`).join('\n');
    const out = execFileSync('cs2cs', ['-d', '4', 'EPSG:4326', 'EPSG:25832'], { input: `${input}\n`, encoding: 'utf8' })
      .trim()
      .split('\n')
      .map((line) => line.split(/\s+/).map(Number));
    picks.forEach((row, k) => {
      // The CSV rounds degrees to 7 decimals (about 1 cm) before cs2cs sees them.
      expect(Math.abs(Number(projected[row]?.[1]) - (out[k]?.[0] as number))).toBeLessThan(0.02);
      expect(Math.abs(Number(projected[row]?.[2]) - (out[k]?.[1] as number))).toBeLessThan(0.02);
    });
    // At 5.4° E a plain 6° zone would be 31; the 32V exception puts the easting west of zone 32's centre.
    expect(Number(projected[0]?.[1])).toBeLessThan(320_000);
  });

  it('writes GPX 1.1 that xmllint validates against the published XSD, with both tracks', () => {
    const [gpx] = writeDiveLogs(north, 'gpx');
    const dir = mkdtempSync(join(tmpdir(), 'leadline-gpx-'));
    try {
      const file = join(dir, 'dive.gpx');
      writeFileSync(file, gpx?.text ?? '');
      // Reference: libxml2's xmllint against the GPX 1.1 schema (topografix.com; the project's vendored copy).
      const result = execFileSync('xmllint', ['--noout', '--schema', GPX_XSD, file], {
        encoding: 'utf8',
        stdio: 'pipe',
      });
      expect(result).toBe('');
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
    expect(gpx?.text.match(/<trkpt /g)?.length).toBe(north.vehicleLog.length + north.surfaceLog.length);
    expect(gpx?.text).toContain('<name>surface unit</name>');
  });

  it('writes NMEA 0183 sentences with valid checksums, CRLF line ends, and every fix once', () => {
    const [vehicle, surface] = writeDiveLogs(north, 'nmea');
    for (const file of [vehicle, surface]) {
      const lines = (file?.text ?? '').split('\r\n').filter((l) => l.length > 0);
      for (const line of lines) {
        const m = /^\$([^*]+)\*([0-9A-F]{2})$/.exec(line);
        expect(m).not.toBeNull();
        let sum = 0;
        for (const ch of m?.[1] ?? '') sum ^= ch.charCodeAt(0);
        expect(sum).toBe(Number.parseInt(m?.[2] ?? '', 16));
        // NMEA 0183: at most 82 characters from $ to LF inclusive, so 80 before CRLF (from memory).
        expect(line.length).toBeLessThanOrEqual(80);
      }
    }
    expect(vehicle?.text.match(/\$GPGGA/g)?.length).toBe(north.vehicleLog.length);
    expect(surface?.text.match(/\$GPRMC/g)?.length).toBe(north.surfaceLog.length);
  });
});
