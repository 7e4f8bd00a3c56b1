import { describe, expect, it } from 'vitest';
import { getFix } from '../model/track.js';
import { collectReadEvents } from './collect-read-events.js';
import type { LogReadResult } from './log-read-result.js';
import {
  computeNmeaChecksum,
  parseNmeaCoordinate,
  parseNmeaDate,
  parseTimeOfDay,
  readNmea,
  readNmeaEvents,
} from './read-nmea.js';

// Sentences and decoded values from shared/reference/check-values.md section 5, whose source is
// E. S. Raymond, "NMEA Revealed" (gpsd project, revision of 12 July 2025), unless marked otherwise.
const GGA = '$GNGGA,001043.00,4404.14036,N,12118.85961,W,1,12,0.98,1113.0,M,-21.3,M*47';
const RMC = '$GNRMC,001031.00,A,4404.13993,N,12118.86023,W,0.146,,100117,,,A*7B';
const VTG = '$GPVTG,220.86,T,,M,2.550,N,4.724,K,A*34';
const HDT = '$GPHDT,274.07,T*03';
const ZDA = '$GPZDA,160012.71,11,03,2004,-1,00*7D';
const ROT = '$HEROT,0.0,A*2B';
/** A sentence with its checksum, from the text between `$` and `*`. */
const s = (body: string) => `$${body}*${computeNmeaChecksum(body)}`;
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

  it('reads minutes as Number does and refuses every other shape', () => {
    // minutes = the field after the degree digits, read as a decimal number (from memory: NMEA ddmm.mmmm)
    for (const [value, hemisphere, axis, deg] of [
      ['5626.52780', 'N', 'lat', 2],
      ['00537.16585', 'W', 'lon', 3],
      ['4807', 'N', 'lat', 2],
      ['01131.5', 'E', 'lon', 3],
      ['5959.99999999999999', 'S', 'lat', 2],
      ['9000.0000', 'N', 'lat', 2],
      ['18000', 'W', 'lon', 3],
    ] as const) {
      const minutes = Number(value.slice(deg));
      const magnitude = Number(value.slice(0, deg)) + minutes / 60;
      const expected = hemisphere === 'S' || hemisphere === 'W' ? -magnitude : magnitude;
      expect(parseNmeaCoordinate(value, hemisphere, axis)).toBe(expected);
    }
    for (const [value, hemisphere, axis] of [
      ['48.07038', 'N', 'lat'],
      ['4807.', 'N', 'lat'],
      ['807.038', 'N', 'lat'],
      ['48077.038', 'N', 'lat'],
      ['48-7.038', 'N', 'lat'],
      ['48+7.038', 'N', 'lat'],
      ['4807.0-38', 'N', 'lat'],
      ['4807.03 ', 'N', 'lat'],
      ['4807.038', 'n', 'lat'],
      ['4807.038', 'NN', 'lat'],
      ['01131.000', 'N', 'lon'],
      ['9000.0001', 'N', 'lat'],
      ['18000.0001', 'E', 'lon'],
      ['', 'N', 'lat'],
    ] as const) {
      expect(parseNmeaCoordinate(value, hemisphere, axis), `${value} ${hemisphere}`).toBeUndefined();
    }
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

  it('counts every sentence merged into a fix or not used, and reads HDG with and without variation', () => {
    const text = [
      s('GPZDA,084600.00,13,03,2026,00,00'),
      s('GPGGA,084600.00,5626.52780,N,00537.16585,W,2,08,1.0,-0.36,M,,M,,'),
      s('GPRMC,084600.00,A,5626.52780,N,00537.16585,W,1.00,0.0,130326,,,D'),
      s('GPVTG,0.0,T,,M,2.00,N,3.70,K,D'),
      s('HCHDG,42.8,1.5,E,2.0,W'),
      s('GPZDA,084601.00,13,03,2026,00,00'),
      s('GPGGA,084601.00,5626.52800,N,00537.16638,W,2,08,1.0,-0.44,M,,M,,'),
      s('HCHDG,42.8,,,,'),
      s('PXYZ,1,2'),
      s('GPGSV,3,1,11'),
    ].join('\n');
    const result = readNmea({ fileName: 'count.nmea', content: text });
    const track = result.tracks[0];
    expect(track?.length).toBe(2);
    // ZDA x2, the RMC merged into the GGA of its time, VTG, HDG x2, PXYZ, GSV
    expect(result.nonFixRowCount).toBe(8);
    expect(result.rowCount).toBe(10);
    // true heading = magnetic + deviation (E positive) + variation (W negative): 42.8 + 1.5 - 2.0 (from memory: NMEA HDG)
    expect(track?.columns.headingDeg[0]).toBeCloseTo(42.3, 9);
    expect(track?.columns.speedMps[0]).toBeCloseTo(2 * (1852 / 3600), 9); // VTG's knots win over the RMC's
    expect(Number.isNaN(track?.columns.headingDeg[1])).toBe(true);
    expect(result.notes).toEqual([
      'sentences not used: PXYZ x1, GSV x1',
      '1 HDG sentences had no magnetic variation: their magnetic heading was not used',
    ]);
  });

  it('rejects bad sentences with their line, reason and message', () => {
    const text = [
      '  $GPGGA,084600.00,5626.52780,N,00537.16585,W,2,08,1.0,-0.36,M,,M,,*78',
      s('GPGGA,084601.00,5626.52780,N,00537.16585,W,2,08,1.0,-0.36,M,,M,,'),
      s('GPZDA,084600.00,13,03,26,00,00'),
      s('GPGGA,084602.00,5626.52780,N'),
      s('GPGGA,0846,5626.52780,N,00537.16585,W,2,08,1.0,-0.36,M,,M,,'),
      'not a sentence',
      s('GPZDA,084603.00,13,03,2026,00,00'),
    ].join('\r\n');
    const result = readNmea({ fileName: 'bad.nmea', content: text });
    expect(result.rejections).toEqual([
      {
        file: 'bad.nmea',
        line: 1,
        column: 68, // the `*`, counted from the start of the line (1-based)
        code: 'bad-checksum',
        expected: 'checksum 79 (XOR of the characters between $ and *)',
        found: '*78',
      },
      {
        file: 'bad.nmea',
        line: 3,
        code: 'unparsable-time',
        expected: 'a ZDA with hhmmss.ss, day, month and 4-digit year',
        found: `"${s('GPZDA,084600.00,13,03,26,00,00')}"`,
      },
      {
        file: 'bad.nmea',
        line: 4,
        code: 'no-fix',
        expected: 'a GGA position with fix quality 1-8',
        found: 'an empty position',
      },
      {
        file: 'bad.nmea',
        line: 5,
        column: 2,
        code: 'unparsable-time',
        expected: 'a UTC time of day hhmmss.ss in GGA field 1',
        found: '"0846"',
      },
      {
        file: 'bad.nmea',
        line: 6,
        code: 'unsupported-sentence',
        expected: 'an NMEA 0183 sentence ($, talker ID, sentence type, fields)',
        found: '"not a sentence"',
      },
    ]);
    // the GGA on line 2 came before any date and took the ZDA's on line 7
    expect(result.tracks[0]?.columns.timeMs[0]).toBe(Date.UTC(2026, 2, 13, 8, 46, 1));
    expect(result.rowCount).toBe(7);
    expect(result.nonFixRowCount).toBe(1);
  });
});

/** Reads `text` as one string (lines found while scanning sentences) and as small chunks (the general line splitter). */
function readBothWays(text: string, chunkChars = 7): [LogReadResult, LogReadResult] {
  const read = (chunks: string[]) =>
    collectReadEvents(readNmeaEvents({ fileName: 'both.nmea', chunks }), { fileName: 'both.nmea', format: 'nmea' });
  const pieces: string[] = [];
  for (let at = 0; at < text.length; at += chunkChars) pieces.push(text.slice(at, at + chunkChars));
  return [read([text]), read(pieces)];
}

describe('readNmeaEvents', () => {
  /** One fix a second from `startSecond` on: ZDA, GGA, HDT, like the season's vehicle logs. */
  const fixLines = (startSecond: number, count: number): string[] => {
    const lines: string[] = [];
    for (let k = 0; k < count; k++) {
      const t = startSecond + k;
      const hhmmss = `${String(Math.floor(t / 3600) % 24).padStart(2, '0')}${String(Math.floor(t / 60) % 60).padStart(2, '0')}${String(t % 60).padStart(2, '0')}.00`;
      const minutes = (26.5278 + k * 1e-5).toFixed(5);
      lines.push(
        s(`GPZDA,${hhmmss},13,03,2026,00,00`),
        s(`GPGGA,${hhmmss},56${minutes},N,00537.16585,W,2,08,1.0,-${(k % 50) / 10},M,,M,,`),
        s(`HEHDT,${(k % 360) + 0.5},T`),
      );
    }
    return lines;
  };

  it('finds the same lines, fixes, rejections and counts in one string as in chunks', () => {
    const edgeCases = [
      s('GPGGA,235958.00,5907.2000,N,00512.6000,E,1,10,0.9,-20.0,M,40.0,M,,'), // before any date
      '',
      '   ',
      s('GPZDA,235959.00,31,12,2026,00,00'),
      `${s('GPGGA,235959.00,5907.2006,N,00512.6006,E,1,10,0.9,-20.1,M,40.0,M,,')}  `, // trailing blanks
      s('GNGGA,000000.00,5907.2012,N,00512.6012,E,1,10,0.9,-20.2,M,40.0,M,,'), // midnight passed
      s('gpgga,000001.00,5907.2018,n,00512.6018,e,1,10,0.9,-20.3,m,40.0,m,,').toLowerCase(),
      s('INHDT,45.2,T').replace(/\*..$/, '*00'), // bad checksum
      s('INGGA,000002.00,5907.2018,N,00512.6018,E,0,10,0.9,-20.3,M,40.0,M,,'), // quality 0
      s('INGGA,000003.00,5907.2018,N'), // missing fields
      'GPGGA,000004.00,5907.2018,N,00512.6018,E,1,10,0.9,-20.3,M,40.0,M,,', // no $
      '$GPGGA,000005.00,5907.2018,N,00512.6018,E,1,10,0.9,-20.3,M,40.0,M,,', // no checksum
      `12:00:05 ${s('GPHDT,46.0,T')}`, // text before the $
      s('PGRME,15.0,M,45.0,M,25.0,M'), // proprietary
      s('AIVDM,1,1,,A,13u?etPv2;0n:dDPwUM1U1Cb069D,0').replace('$', '!'),
      s('GPZDA,000006.00,1,1,2027,00,00'), // one-digit day and month
      s('GPHDG,101.0,,,2.5,W'),
      s('GPVTG,45.0,T,,M,0.6,N,1.1,K,A'),
      s('GPVTG,45.0,0.6,1.1'), // the older VTG form
      s('GPRMC,000007.00,A,5907.2018,N,00512.6018,E,0.6,45.0,010127,,,A'),
      s('GPRMC,000008.00,V,,,,,,,010127,,,N'),
      s('GPGGA,000009.00,5907.2018,N,00512.6018,E,1,10,0.9,-20.3,M,40.0,M,,').replace('*', ',,,,*'),
      `$GPGGA,${'9'.repeat(100)}`, // over 82 characters
      `$GP${'x'.repeat(70_000)}`, // over MAX_LINE_CHARS
      s('GPHDT,12.0,T'),
      `${s('GPHDT,47.0,T').replace(/\*..$/, '*00')} \t`, // bad checksum, then white space
    ];
    for (const [eol, last] of [
      ['\n', '\n'],
      ['\r\n', '\r\n'],
      ['\r', '\r'],
      ['\r', ''],
      ['\r\n', ''],
    ]) {
      const text = edgeCases.join(eol) + last;
      const [whole, chunked] = readBothWays(text);
      expect(whole).toEqual(chunked);
      expect(whole.rejections.map((r) => [r.line, r.code])).toEqual([
        [7, 'unparsable-coordinate'], // a lower-case hemisphere
        [8, 'bad-checksum'],
        [9, 'no-fix'],
        [10, 'no-fix'],
        [11, 'unsupported-sentence'],
        [21, 'no-fix'],
        [23, 'unparsable-time'],
        [24, 'line-too-long'],
        [26, 'bad-checksum'],
      ]);
      expect(whole.rejections.at(-1)?.found).toBe('*00');
      expect(whole.rowCount).toBe(edgeCases.length - 2);
      // without the line over MAX_LINE_CHARS, the whole text fits one byte window
      const short = edgeCases.filter((l) => l.length < 1000);
      const [whole2, chunked2] = readBothWays(short.join(eol) + last);
      expect(whole2).toEqual(chunked2);
      expect(whole2.rowCount).toBe(short.length - 2);
    }
  });

  it('reads a log longer than its byte window, with a line that is not ASCII, the same as in chunks', () => {
    const lines = fixLines(30_000, 2500);
    // lines cross the 64 KiB window at some point; a non-ASCII line half-way sends the rest the general way
    const [whole, chunked] = readBothWays(lines.join('\r\n'), 4096);
    expect(whole).toEqual(chunked);
    expect(whole.tracks[0]?.length).toBe(2500);
    expect(whole.nonFixRowCount).toBe(5000);
    const withAccent = [...lines.slice(0, 3000), '$GPTXT,01,01,02,Vérifié*00', ...lines.slice(3000)];
    const [whole2, chunked2] = readBothWays(withAccent.join('\n'), 4096);
    expect(whole2).toEqual(chunked2);
    expect(whole2.tracks[0]?.length).toBe(2500);
    expect(whole2.rejections.map((r) => [r.line, r.code])).toEqual([[3001, 'bad-checksum']]);
  });

  it('reads a coordinate with thousands of digits as Number does, on both ways', () => {
    const minutes = `26.${'5'.repeat(20_000)}`;
    const text = [
      s('GPZDA,084600.00,13,03,2026,00,00'),
      s(`GPGGA,084600.00,56${minutes},N,00537.16585,W,2,08,1.0,-0.36,M,,M,,`),
    ].join('\n');
    const [whole, chunked] = readBothWays(text, 1000);
    expect(whole).toEqual(chunked);
    expect(whole.tracks[0]?.columns.latDeg[0]).toBe(56 + Number(minutes) / 60);
    expect(whole.notes).toContain('1 sentences are longer than the 82 characters NMEA 0183 allows; read anyway');
  });

  it('hands on non-fix rows as counts, never an event per row, and fixes in batches', () => {
    const events = [...readNmeaEvents({ fileName: 'v.nmea', chunks: [fixLines(0, 5000).join('\n')] })];
    const kinds = events.map((e) => e.kind);
    expect(kinds).not.toContain('non-fix-row');
    const counted = events.reduce((n, e) => n + (e.kind === 'non-fix-rows' ? e.count : 0), 0);
    expect(counted).toBe(10_000);
    expect(kinds.filter((k) => k === 'fix-batch').length).toBeLessThanOrEqual(3);
    const track = events[0];
    expect(track?.kind === 'track' ? track.capacityHint : undefined).toBeGreaterThanOrEqual(5000);
  });
});
