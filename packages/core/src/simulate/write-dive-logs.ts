/**
 * Writes a simulated dive as the log files a topside would leave behind, in Leadline's own generic
 * layouts (invented for the simulator, not any system's). Every layout holds the same rows.
 *
 * Vehicle CSV (`<base>_vehicle.csv`), one row per vehicle fix, header first:
 * `time_utc, vehicle_lat_deg, vehicle_lon_deg, vehicle_depth_m, vehicle_heading_deg,
 * slant_range_m, bearing_rel_deg, surface_lat_deg, surface_lon_deg, surface_heading_deg`
 * - time ISO 8601 UTC with milliseconds (`2026-03-14T09:12:05.000Z`); positions WGS 84 decimal
 *   degrees (7 decimals) as the topside computed them; depth metres positive down; vehicle heading
 *   true; slant range metres as logged (assumed sound speed); bearing relative to the surface
 *   unit's forward axis, clockwise; surface position and compass heading as the GNSS and compass
 *   logged them.
 *
 * Surface-unit CSV (`<base>_surface.csv`), one row per GNSS epoch:
 * `time_utc, surface_lat_deg, surface_lon_deg, surface_heading_deg, speed_mps, course_deg, gnss_quality`
 * (heading is the compass heading as logged; quality is the NMEA GGA code).
 *
 * Dialects (same columns unless said):
 * - `csv`: comma, LF, as above.
 * - `csv-semicolon-decimal-comma`: `;` between fields, `,` as the decimal mark.
 * - `csv-ddm`: positions as degrees and decimal minutes with a hemisphere letter
 *   (`59°01.23457'N`, `005°28.12345'E`); columns `vehicle_lat`, `vehicle_lon`, `surface_lat`, `surface_lon`.
 * - `csv-dms`: degrees, minutes, seconds with a hemisphere letter (`59°01'14.074"N`, quoted as CSV
 *   requires); same column names as `csv-ddm`.
 * - `csv-epoch-ms`: `time_epoch_ms` (UTC ms since 1970) instead of `time_utc`.
 * - `csv-date-time`: `date_utc` (`2026-03-14`) and `time_utc` (`09:12:05.000`) columns.
 * - `csv-local-time`: `local_time` (`2026-03-29 01:59:59`, no offset) in the site's IANA zone,
 *   stated beside the file (`timeZone`); times jump where the zone changes to or from summer time.
 * - `csv-crlf-bom`: as `csv` with a UTF-8 byte-order mark and CRLF line ends.
 * - `csv-projected`: easting/northing in metres in the site's EPSG CRS (stated beside the file,
 *   `crs`) instead of latitude/longitude: `vehicle_easting_m, vehicle_northing_m, ...,
 *   surface_easting_m, surface_northing_m`.
 * - `gpx`: one GPX 1.1 file (`<base>.gpx`) with two tracks, `vehicle` (`ele` = −depth, and the raw
 *   observations in `extensions` in the namespace `urn:leadline:simulated:1`: `depth_m`,
 *   `heading_deg`, `slant_range_m`, `bearing_rel_deg`) and `surface unit` (`extensions`:
 *   `heading_deg`).
 * - `nmea`: NMEA 0183 streams, CRLF, checksummed: `<base>_vehicle.nmea` (per fix `GPZDA`, `GPGGA`
 *   with altitude = −depth, `HEHDT`) and `<base>_surface.nmea` (per epoch `GPZDA`, `GPGGA`,
 *   `GPRMC`, `GPVTG`, `HCHDG` with the compass heading).
 */
import { DateTime } from 'luxon';
import { createReprojection } from '../crs/create-reprojection.js';
import { resolveCrs } from '../crs/resolve-crs.js';
import type { LogFormat } from '../model/track.js';
import { MPS_PER_KNOT } from '../model/units.js';
import type { SimulatedDive } from './simulate-dive.js';

/** The log layouts the simulator writes (see the module comment for each). */
export const LOG_DIALECTS = [
  'csv',
  'csv-semicolon-decimal-comma',
  'csv-ddm',
  'csv-dms',
  'csv-epoch-ms',
  'csv-date-time',
  'csv-local-time',
  'csv-crlf-bom',
  'csv-projected',
  'gpx',
  'nmea',
] as const;

/** One of `LOG_DIALECTS`. */
export type LogDialect = (typeof LOG_DIALECTS)[number];

/** One written log file: a relative path, its text, and what a reader needs to be told about it. */
export interface SimulatedFile {
  /** Relative path with forward slashes, e.g. `skarvholmen/2026-03-14_0912_HT-007_vehicle.csv`. */
  name: string;
  role: 'vehicle' | 'surface' | 'both';
  format: LogFormat;
  dialect: LogDialect;
  text: string;
  /** The IANA zone of local times in the file, when it holds local times. */
  timeZone?: string;
  /** The EPSG CRS of projected coordinates in the file, when it holds them. */
  crs?: string;
}

/** The base file name of a dive's logs: site folder, local start date and time, dive id. */
export function diveFileBase(dive: SimulatedDive): string {
  const { site } = dive.spec;
  const local = DateTime.fromMillis(dive.truth.startTimeMs, { zone: site.timeZone });
  return `${site.id}/${local.toFormat('yyyy-MM-dd_HHmm')}_${dive.spec.diveId}`;
}

const SEPARATOR: Partial<Record<LogDialect, string>> = { 'csv-semicolon-decimal-comma': ';' };

function hemisphere(value: number, positive: string, negative: string): string {
  return value < 0 ? negative : positive;
}

function splitDegrees(value: number, minuteDecimals: number): { degrees: number; minutes: number } {
  // Round the minutes first so 59.9999995' never prints as 60'.
  const scale = 10 ** minuteDecimals;
  const totalMinutes = Math.round(Math.abs(value) * 60 * scale) / scale;
  const degrees = Math.floor(totalMinutes / 60 + 1e-12);
  return { degrees, minutes: totalMinutes - degrees * 60 };
}

function formatDdm(value: number, isLat: boolean): string {
  const { degrees, minutes } = splitDegrees(value, 5);
  const degreeText = String(degrees).padStart(isLat ? 2 : 3, '0');
  return `${degreeText}°${minutes.toFixed(5).padStart(8, '0')}'${isLat ? hemisphere(value, 'N', 'S') : hemisphere(value, 'E', 'W')}`;
}

function formatDms(value: number, isLat: boolean): string {
  const scale = 1000;
  const totalSeconds = Math.round(Math.abs(value) * 3600 * scale) / scale;
  const degrees = Math.floor(totalSeconds / 3600 + 1e-12);
  const minutes = Math.floor((totalSeconds - degrees * 3600) / 60 + 1e-12);
  const seconds = totalSeconds - degrees * 3600 - minutes * 60;
  const degreeText = String(degrees).padStart(isLat ? 2 : 3, '0');
  const letter = isLat ? hemisphere(value, 'N', 'S') : hemisphere(value, 'E', 'W');
  // The seconds mark is a double quote, so CSV needs the field quoted and the quote doubled.
  return `"${degreeText}°${String(minutes).padStart(2, '0')}'${seconds.toFixed(3).padStart(6, '0')}""${letter}"`;
}

interface CsvShape {
  separator: string;
  decimalComma: boolean;
  lineEnd: string;
  bom: boolean;
  timeHeader: string[];
  time: (ms: number) => string;
  positionHeader: (prefix: string) => string[];
  position: (lat: number, lon: number, x: number, y: number) => string;
}

const DAY_MS = 86_400_000;
let cachedDay = Number.NaN;
let cachedDayPrefix = '';

function pad2(n: number): string {
  return n < 10 ? `0${n}` : `${n}`;
}

/**
 * ISO 8601 UTC with milliseconds, the same text as `Date.prototype.toISOString` for years 0–9999,
 * about five times faster: the date part is cached per UTC day (logs run through days in order).
 */
function isoTime(ms: number): string {
  const t = Math.floor(ms);
  const day = Math.floor(t / DAY_MS);
  if (day !== cachedDay) {
    cachedDay = day;
    cachedDayPrefix = new Date(day * DAY_MS).toISOString().slice(0, 11);
  }
  let rest = t - day * DAY_MS;
  const h = Math.floor(rest / 3_600_000);
  rest -= h * 3_600_000;
  const m = Math.floor(rest / 60_000);
  rest -= m * 60_000;
  const s = Math.floor(rest / 1000);
  rest -= s * 1000;
  return `${cachedDayPrefix}${pad2(h)}:${pad2(m)}:${pad2(s)}.${rest < 10 ? `00${rest}` : rest < 100 ? `0${rest}` : rest}Z`;
}

// Zone offsets change only on whole quarter hours of UTC, so one luxon lookup per quarter hour is exact.
const QUARTER_HOUR_MS = 900_000;

function localTimeFormatter(zone: string): (ms: number) => string {
  let block = Number.NaN;
  let offsetMs = 0;
  return (ms) => {
    const current = Math.floor(ms / QUARTER_HOUR_MS);
    if (current !== block) {
      block = current;
      offsetMs = DateTime.fromMillis(current * QUARTER_HOUR_MS, { zone }).offset * 60_000;
    }
    const iso = isoTime(ms + offsetMs);
    return `${iso.slice(0, 10)} ${iso.slice(11, 19)}`;
  };
}

function csvShape(dive: SimulatedDive, dialect: LogDialect): CsvShape {
  const separator = SEPARATOR[dialect] ?? ',';
  const decimalComma = dialect === 'csv-semicolon-decimal-comma';
  const fixed = (value: number, decimals: number) =>
    decimalComma ? value.toFixed(decimals).replace('.', ',') : value.toFixed(decimals);
  const shape: CsvShape = {
    separator,
    decimalComma,
    lineEnd: dialect === 'csv-crlf-bom' ? '\r\n' : '\n',
    bom: dialect === 'csv-crlf-bom',
    timeHeader: ['time_utc'],
    time: isoTime,
    positionHeader: (prefix) => [`${prefix}_lat_deg`, `${prefix}_lon_deg`],
    position: (lat, lon) => `${fixed(lat, 7)}${separator}${fixed(lon, 7)}`,
  };
  switch (dialect) {
    case 'csv-ddm':
      shape.positionHeader = (prefix) => [`${prefix}_lat`, `${prefix}_lon`];
      shape.position = (lat, lon) => `${formatDdm(lat, true)}${separator}${formatDdm(lon, false)}`;
      break;
    case 'csv-dms':
      shape.positionHeader = (prefix) => [`${prefix}_lat`, `${prefix}_lon`];
      shape.position = (lat, lon) => `${formatDms(lat, true)}${separator}${formatDms(lon, false)}`;
      break;
    case 'csv-epoch-ms':
      shape.timeHeader = ['time_epoch_ms'];
      shape.time = (ms) => String(Math.round(ms));
      break;
    case 'csv-date-time':
      shape.timeHeader = ['date_utc', 'time_utc'];
      shape.time = (ms) => {
        const iso = isoTime(ms);
        return `${iso.slice(0, 10)}${separator}${iso.slice(11, 23)}`;
      };
      break;
    case 'csv-local-time': {
      const zone = dive.spec.site.timeZone;
      shape.timeHeader = ['local_time'];
      shape.time = localTimeFormatter(zone);
      break;
    }
    case 'csv-projected':
      shape.positionHeader = (prefix) => [`${prefix}_easting_m`, `${prefix}_northing_m`];
      shape.position = (_lat, _lon, x, y) => `${fixed(x, 3)}${separator}${fixed(y, 3)}`;
      break;
    default:
      break;
  }
  return shape;
}

function projectColumns(crs: string, latDeg: Float64Array, lonDeg: Float64Array): { x: Float64Array; y: Float64Array } {
  const projected = createReprojection(resolveCrs(crs)).forward(lonDeg, latDeg);
  return { x: projected.x, y: projected.y };
}

function writeVehicleCsv(dive: SimulatedDive, dialect: LogDialect): string {
  const shape = csvShape(dive, dialect);
  const log = dive.vehicleLog;
  const s = shape.separator;
  const fixed = (value: number, decimals: number) =>
    shape.decimalComma ? value.toFixed(decimals).replace('.', ',') : value.toFixed(decimals);
  const vehicle = dialect === 'csv-projected' ? projectColumns(dive.spec.site.crs, log.latDeg, log.lonDeg) : undefined;
  const surface =
    dialect === 'csv-projected' ? projectColumns(dive.spec.site.crs, log.surfaceLatDeg, log.surfaceLonDeg) : undefined;
  const header = [
    ...shape.timeHeader,
    ...shape.positionHeader('vehicle'),
    'vehicle_depth_m',
    'vehicle_heading_deg',
    'slant_range_m',
    'bearing_rel_deg',
    ...shape.positionHeader('surface'),
    'surface_heading_deg',
  ].join(s);
  const lines: string[] = [header];
  for (let i = 0; i < log.length; i++) {
    lines.push(
      `${shape.time(log.timeMs[i] as number)}${s}${shape.position(
        log.latDeg[i] as number,
        log.lonDeg[i] as number,
        vehicle?.x[i] ?? 0,
        vehicle?.y[i] ?? 0,
      )}${s}${fixed(log.depthM[i] as number, 2)}${s}${fixed(log.headingDeg[i] as number, 1)}${s}${fixed(
        log.slantRangeM[i] as number,
        2,
      )}${s}${fixed(log.bearingDeg[i] as number, 2)}${s}${shape.position(
        log.surfaceLatDeg[i] as number,
        log.surfaceLonDeg[i] as number,
        surface?.x[i] ?? 0,
        surface?.y[i] ?? 0,
      )}${s}${fixed(log.surfaceHeadingDeg[i] as number, 1)}`,
    );
  }
  return `${shape.bom ? '\uFEFF' : ''}${lines.join(shape.lineEnd)}${shape.lineEnd}`;
}

function writeSurfaceCsv(dive: SimulatedDive, dialect: LogDialect): string {
  const shape = csvShape(dive, dialect);
  const log = dive.surfaceLog;
  const s = shape.separator;
  const fixed = (value: number, decimals: number) =>
    shape.decimalComma ? value.toFixed(decimals).replace('.', ',') : value.toFixed(decimals);
  const projected =
    dialect === 'csv-projected' ? projectColumns(dive.spec.site.crs, log.latDeg, log.lonDeg) : undefined;
  const header = [
    ...shape.timeHeader,
    ...shape.positionHeader('surface'),
    'surface_heading_deg',
    'speed_mps',
    'course_deg',
    'gnss_quality',
  ].join(s);
  const lines: string[] = [header];
  const quality = String(log.quality);
  for (let i = 0; i < log.length; i++) {
    lines.push(
      `${shape.time(log.timeMs[i] as number)}${s}${shape.position(
        log.latDeg[i] as number,
        log.lonDeg[i] as number,
        projected?.x[i] ?? 0,
        projected?.y[i] ?? 0,
      )}${s}${fixed(log.headingDeg[i] as number, 1)}${s}${fixed(log.speedMps[i] as number, 2)}${s}${fixed(
        log.courseDeg[i] as number,
        1,
      )}${s}${quality}`,
    );
  }
  return `${shape.bom ? '\uFEFF' : ''}${lines.join(shape.lineEnd)}${shape.lineEnd}`;
}

const GPX_NAMESPACE = 'urn:leadline:simulated:1';

function writeGpx(dive: SimulatedDive): string {
  const v = dive.vehicleLog;
  const u = dive.surfaceLog;
  const out: string[] = [
    '<?xml version="1.0" encoding="UTF-8"?>',
    `<gpx version="1.1" creator="Leadline simulator" xmlns="http://www.topografix.com/GPX/1/1" xmlns:xsi="http://www.w3.org/2001/XMLSchema-instance" xmlns:ll="${GPX_NAMESPACE}" xsi:schemaLocation="http://www.topografix.com/GPX/1/1 http://www.topografix.com/GPX/1/1/gpx.xsd">`,
    '  <metadata>',
    `    <name>${dive.spec.diveId}</name>`,
    `    <desc>Simulated dive at ${dive.spec.site.name} (invented data)</desc>`,
    `    <time>${isoTime(dive.truth.startTimeMs)}</time>`,
    '  </metadata>',
    '  <trk>',
    '    <name>vehicle</name>',
    '    <type>vehicle</type>',
    '    <trkseg>',
  ];
  for (let i = 0; i < v.length; i++) {
    const depth = (v.depthM[i] as number).toFixed(2);
    out.push(
      `      <trkpt lat="${(v.latDeg[i] as number).toFixed(7)}" lon="${(v.lonDeg[i] as number).toFixed(7)}"><ele>${
        depth === '0.00' ? depth : `-${depth}`
      }</ele><time>${isoTime(v.timeMs[i] as number)}</time><extensions><ll:depth_m>${depth}</ll:depth_m><ll:heading_deg>${(
        v.headingDeg[i] as number
      ).toFixed(1)}</ll:heading_deg><ll:slant_range_m>${(v.slantRangeM[i] as number).toFixed(
        2,
      )}</ll:slant_range_m><ll:bearing_rel_deg>${(v.bearingDeg[i] as number).toFixed(2)}</ll:bearing_rel_deg></extensions></trkpt>`,
    );
  }
  out.push(
    '    </trkseg>',
    '  </trk>',
    '  <trk>',
    '    <name>surface unit</name>',
    '    <type>surface</type>',
    '    <trkseg>',
  );
  for (let i = 0; i < u.length; i++) {
    out.push(
      `      <trkpt lat="${(u.latDeg[i] as number).toFixed(7)}" lon="${(u.lonDeg[i] as number).toFixed(7)}"><time>${isoTime(
        u.timeMs[i] as number,
      )}</time><extensions><ll:heading_deg>${(u.headingDeg[i] as number).toFixed(1)}</ll:heading_deg></extensions></trkpt>`,
    );
  }
  out.push('    </trkseg>', '  </trk>', '</gpx>', '');
  return out.join('\n');
}

function nmeaSentence(body: string): string {
  let checksum = 0;
  for (let i = 0; i < body.length; i++) checksum ^= body.charCodeAt(i);
  return `$${body}*${checksum.toString(16).toUpperCase().padStart(2, '0')}\r\n`;
}

function nmeaLatitude(value: number): string {
  const { degrees, minutes } = splitDegrees(value, 5);
  return `${String(degrees).padStart(2, '0')}${minutes.toFixed(5).padStart(8, '0')},${hemisphere(value, 'N', 'S')}`;
}

function nmeaLongitude(value: number): string {
  const { degrees, minutes } = splitDegrees(value, 5);
  return `${String(degrees).padStart(3, '0')}${minutes.toFixed(5).padStart(8, '0')},${hemisphere(value, 'E', 'W')}`;
}

function nmeaTimes(ms: number): { hms: string; zda: string; ddmmyy: string } {
  const iso = isoTime(ms);
  const hms = `${iso.slice(11, 13)}${iso.slice(14, 16)}${iso.slice(17, 19)}.${iso.slice(20, 22)}`;
  const zda = `${hms},${iso.slice(8, 10)},${iso.slice(5, 7)},${iso.slice(0, 4)},00,00`;
  return { hms, zda, ddmmyy: `${iso.slice(8, 10)}${iso.slice(5, 7)}${iso.slice(2, 4)}` };
}

function writeVehicleNmea(dive: SimulatedDive): string {
  const v = dive.vehicleLog;
  const out: string[] = [];
  for (let i = 0; i < v.length; i++) {
    const t = nmeaTimes(v.timeMs[i] as number);
    const altitude = -(v.depthM[i] as number);
    out.push(
      nmeaSentence(`GPZDA,${t.zda}`),
      nmeaSentence(
        `GPGGA,${t.hms},${nmeaLatitude(v.latDeg[i] as number)},${nmeaLongitude(v.lonDeg[i] as number)},2,08,1.0,${(altitude === 0 ? 0 : altitude).toFixed(2)},M,,M,,`,
      ),
      nmeaSentence(`HEHDT,${(v.headingDeg[i] as number).toFixed(1)},T`),
    );
  }
  return out.join('');
}

function writeSurfaceNmea(dive: SimulatedDive): string {
  const u = dive.surfaceLog;
  const out: string[] = [];
  const quality = u.quality;
  const mode = quality === 4 ? 'R' : 'D';
  for (let i = 0; i < u.length; i++) {
    const t = nmeaTimes(u.timeMs[i] as number);
    const lat = nmeaLatitude(u.latDeg[i] as number);
    const lon = nmeaLongitude(u.lonDeg[i] as number);
    const knots = ((u.speedMps[i] as number) / MPS_PER_KNOT).toFixed(2);
    const kmh = ((u.speedMps[i] as number) * 3.6).toFixed(2);
    const course = (u.courseDeg[i] as number).toFixed(1);
    out.push(
      nmeaSentence(`GPZDA,${t.zda}`),
      nmeaSentence(`GPGGA,${t.hms},${lat},${lon},${quality},12,0.8,2.50,M,,M,,`),
      nmeaSentence(`GPRMC,${t.hms},A,${lat},${lon},${knots},${course},${t.ddmmyy},,,${mode}`),
      nmeaSentence(`GPVTG,${course},T,,M,${knots},N,${kmh},K,${mode}`),
      nmeaSentence(`HCHDG,${(u.headingDeg[i] as number).toFixed(1)},,,,`),
    );
  }
  return out.join('');
}

/**
 * Writes one simulated dive's logs in `dialect`: a vehicle and a surface-unit file (CSV and NMEA
 * dialects) or one GPX file with both tracks. File names start with `diveFileBase(dive)`. Projected
 * dialects use the site's CRS through `resolveCrs`; a CRS that cannot be resolved throws
 * `InvalidArgumentError`. Pure and deterministic.
 */
export function writeDiveLogs(dive: SimulatedDive, dialect: LogDialect): SimulatedFile[] {
  const base = diveFileBase(dive);
  const { timeZone, crs } = dive.spec.site;
  if (dialect === 'gpx') return [{ name: `${base}.gpx`, role: 'both', format: 'gpx', dialect, text: writeGpx(dive) }];
  if (dialect === 'nmea')
    return [
      { name: `${base}_vehicle.nmea`, role: 'vehicle', format: 'nmea', dialect, text: writeVehicleNmea(dive) },
      { name: `${base}_surface.nmea`, role: 'surface', format: 'nmea', dialect, text: writeSurfaceNmea(dive) },
    ];
  const extra = {
    ...(dialect === 'csv-local-time' ? { timeZone } : {}),
    ...(dialect === 'csv-projected' ? { crs } : {}),
  };
  return [
    {
      name: `${base}_vehicle.csv`,
      role: 'vehicle',
      format: 'csv',
      dialect,
      text: writeVehicleCsv(dive, dialect),
      ...extra,
    },
    {
      name: `${base}_surface.csv`,
      role: 'surface',
      format: 'csv',
      dialect,
      text: writeSurfaceCsv(dive, dialect),
      ...extra,
    },
  ];
}
