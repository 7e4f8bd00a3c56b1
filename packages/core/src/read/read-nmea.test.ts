import { describe, expect, it } from 'vitest';
import { getFix } from '../model/track.js';
import { computeNmeaChecksum, parseNmeaCoordinate, parseNmeaDate, parseTimeOfDay, readNmea } from './read-nmea.js';

// Sentences and decoded values from shared/reference/check-values.md section 5, whose source is
// E. S. Raymond, "NMEA Revealed" (gpsd project, revision of 12 July 2025), unless marked otherwise.
const GGA = '$GNGGA,001043.00,4404.14036,N,12118.85961,W,1,12,0.98,1113.0,M,-21.3,M*47';
const RMC = '$GNRMC,001031.00,A,4404.13993,N,12118.86023,W,0.146,,100117,,,A*7B';
const VTG = '$GPVTG,220.86,T,,M,2.550,N,4.724,K,A*34';
const HDT = '$GPHDT,274.07,T*03';
const ZDA = '$GPZDA,160012.71,11,03,2004,-1,00*7D';
const ROT = '$HEROT,0.0,A*2B';
// "Widely reproduced tutorial example" (check-values.md, confidence T/U): checksums verified there.
const GGA_TUTORIAL = '$GPGGA,123519,4807.038,N,01131.000,E,1,08,0.9,545.4,M,46.9,M,,*47';
const RMC_TUTORIAL = '$GPRMC,123519,A,4807.038,N,01131.000,E,022.4,084.4,230394,003.1,W*6A';

describe('computeNmeaChecksum', () => {
  it('reproduces every published checksum (NMEA Revealed, checksum rule)', () => {
    for (const sentence of [GGA, RMC, VTG, HDT, ZDA, ROT, GGA_TUTORIAL, RMC_TUTORIAL]) {
      const star = sentence.indexOf('*');
      expect(computeNmeaChecksum(sentence.slice(1, star))).toBe(sentence.slice(star + 1));
    }
  });
});

describe('parseNmeaCoordinate', () => {
  it('decodes ddmm.mmmm and dddmm.mmmm with hemispheres (NMEA Revealed, GGA/RMC)', () => {
    expect(parseNmeaCoordinate('4404.14036', 'N', 'lat')).toBeCloseTo(44.069006, 7);
    expect(parseNmeaCoordinate('12118.85961', 'W', 'lon')).toBeCloseTo(-121.3143268, 7);
    expect(parseNmeaCoordinate('4807.038', 'N', 'lat')).toBeCloseTo(48.1173, 7);
    expect(parseNmeaCoordinate('01131.000', 'E', 'lon')).toBeCloseTo(11.5166667, 7);
    expect(parseNmeaCoordinate('4404.14036', 'E', 'lat')).toBeUndefined();
    expect(parseNmeaCoordinate('4460.0', 'N', 'lat')).toBeUndefined();
  });
});

describe('parseNmeaDate', () => {
  it('reads ddmmyy with the 1980 pivot', () => {
    expect(parseNmeaDate('100117')).toBe(Date.UTC(2017, 0, 10)); // RMC example: 10 Jan 2017
    expect(parseNmeaDate('230394')).toBe(Date.UTC(1994, 2, 23)); // tutorial RMC: 23 Mar 1994
    expect(parseNmeaDate('320194')).toBeUndefined();
  });
});

describe('parseTimeOfDay', () => {
  it('reads hhmmss.ss', () => {
    expect(parseTimeOfDay('001043.00')).toBe(643_000);
    expect(parseTimeOfDay('160012.71')).toBe(57_612_710);
    expect(parseTimeOfDay('246000')).toBeUndefined();
  });
});

describe('readNmea', () => {
  it('decodes the published GGA, RMC, VTG and HDT examples into one dated track', () => {
    const result = readNmea({ fileName: 'ref.nmea', content: [RMC, GGA, VTG, HDT, ROT].join('\r\n') });
    expect(result.rejections).toEqual([]);
    const track = result.tracks[0];
    expect(track?.length).toBe(2);
    if (track === undefined) return;
    const rmc = getFix(track, 0);
    // RMC: 00:10:31.00 UTC, 10 Jan 2017, 44.0689988 N, 121.3143372 W, 0.146 kn
    expect(rmc.timeMs).toBe(Date.UTC(2017, 0, 10, 0, 10, 31));
    expect(rmc.latDeg).toBeCloseTo(44.0689988, 7);
    expect(rmc.lonDeg).toBeCloseTo(-121.3143372, 7);
    expect(rmc.speedMps).toBeCloseTo(0.146 * (1852 / 3600), 9);
    const gga = getFix(track, 1);
    // GGA: 00:10:43.00 UTC (date carried from the RMC), quality 1, altitude 1113.0 m MSL
    expect(gga.timeMs).toBe(Date.UTC(2017, 0, 10, 0, 10, 43));
    expect(gga.latDeg).toBeCloseTo(44.069006, 7);
    expect(gga.lonDeg).toBeCloseTo(-121.3143268, 7);
    expect(gga.quality).toBe(1);
    expect(gga.depthM).toBe(-1113);
    // VTG 2.550 kn, HDT 274.07 deg true merged into the GGA fix
    expect(gga.speedMps).toBeCloseTo(2.55 * (1852 / 3600), 9);
    expect(gga.headingDeg).toBe(274.07);
    expect(result.rowCount).toBe(5);
    expect(result.nonFixRowCount).toBe(3); // VTG, HDT, ROT
  });

  it('takes the date from ZDA (NMEA Revealed, ZDA: 11 March 2004)', () => {
    const result = readNmea({
      fileName: 'zda.nmea',
      content: `${ZDA}\n$GPGGA,160013.00,4404.14036,N,12118.85961,W,1,12,0.98,1113.0,M,-21.3,M,,*${computeNmeaChecksum('GPGGA,160013.00,4404.14036,N,12118.85961,W,1,12,0.98,1113.0,M,-21.3,M,,')}`,
    });
    expect(result.tracks[0]?.columns.timeMs[0]).toBe(Date.UTC(2004, 2, 11, 16, 0, 13));
  });

  it('rolls the date over at midnight and dates fixes seen before the first date', () => {
    const s = (body: string) => `$${body}*${computeNmeaChecksum(body)}`;
    const text = [
      s('GPGGA,235959.00,5907.2000,N,00512.6000,E,1,10,0.9,-20.0,M,40.0,M,,'),
      s('GPZDA,000000.50,01,01,2027,00,00'),
      s('GPGGA,000001.00,5907.2000,N,00512.6000,E,1,10,0.9,-20.0,M,40.0,M,,'),
      s('GPGGA,235958.00,5907.2000,N,00512.6000,E,1,10,0.9,-20.0,M,40.0,M,,'),
    ].join('\n');
    const times = Array.from(readNmea({ fileName: 'mid.nmea', content: text }).tracks[0]?.columns.timeMs ?? []);
    // The last sentence is 3 s before the previous one's clock, not 24 h later: it is dated the day before
    // (time going backwards is for the audit to flag, a silent one-day jump would hide it).
    expect(times).toEqual([
      Date.UTC(2026, 11, 31, 23, 59, 59),
      Date.UTC(2027, 0, 1, 0, 0, 1),
      Date.UTC(2026, 11, 31, 23, 59, 58),
    ]);
  });

  it('rejects a wrong checksum and accepts any talker ID', () => {
    const bad = GGA.replace('*47', '*46');
    const result = readNmea({
      fileName: 't.nmea',
      content: `${RMC}\n${bad}\n${GGA.replace('$GN', '$XY').replace('*47', `*${computeNmeaChecksum(GGA.slice(1, -3).replace('GN', 'XY'))}`)}`,
    });
    expect(result.rejections.map((r) => [r.line, r.code])).toEqual([[2, 'bad-checksum']]);
    expect(result.tracks[0]?.length).toBe(2);
  });

  it('rejects fixes when the log never gives a date', () => {
    const result = readNmea({ fileName: 'nodate.nmea', content: GGA_TUTORIAL });
    expect(result.rejections.map((r) => r.code)).toEqual(['no-date']);
    expect(result.rowCount).toBe(1);
  });
});
