import { describe, expect, it } from 'vitest';
import { parseCoordinate } from './parse-coordinate.js';
import { parseDecimal, parseDegreeSymbols } from './parse-csv-row-fast.js';

describe('parseDecimal', () => {
  it("gives Number()'s value for every plain decimal and NaN for anything else", () => {
    // Number() is the reference (ECMAScript StringToNumber, correctly rounded).
    const cells = ['0', '-0', '+7', '1.', '.5', '-.25', '12.50', '007.0700', '123456789012345', '1234567890123456'];
    cells.push('9007199254740993', '0.1234567890123456789', '-42.8820958', '147.3419309', '6258365.896');
    for (let i = 0; i < 5_000; i++) {
      const digits = String((i * 2_654_435_761) % 1e9).padStart(1 + (i % 9), '0');
      const point = i % 11;
      const sign = ['', '-', '+'][i % 3];
      cells.push(`${sign}${digits.slice(0, point)}${point <= digits.length ? '.' : ''}${digits.slice(point)}`);
    }
    for (const cell of cells) expect(Object.is(parseDecimal(cell, 0, cell.length), Number(cell)), cell).toBe(true);
    for (const cell of ['', '-', '+', '.', '-.', '1.2.3', '1e5', '0x10', ' 1', '1 ', '1,5', '--1', 'Infinity', 'NaN'])
      expect(parseDecimal(cell, 0, cell.length), cell).toBeNaN();
    // a decimal comma where the dialect has one
    expect(parseDecimal('59,0511749', 0, 10, 44)).toBe(59.0511749);
    expect(parseDecimal('59,05,1', 0, 7, 44)).toBeNaN();
  });
});

describe('parseDegreeSymbols', () => {
  it('gives the value parseCoordinate gives, or NaN to leave the cell to the general path', () => {
    const cells = [`59°01.23457'N`, `005°28'07.407"E`, `59°1'1"S`, `0°00.0'S`, `180°00'00"W`, `42°52.9260'S`];
    for (let i = 0; i < 4_000; i++) {
      const deg = i % 181;
      const min = ((i * 7919) % 60_000) / 1000;
      const hemisphere = 'NSEW'[i % 4];
      cells.push(
        i % 2 === 0
          ? `${deg}°${min.toFixed(i % 6)}'${hemisphere}`
          : `${deg}°${Math.floor(min)}'${(((i * 104_729) % 60_000) / 1000).toFixed(i % 4)}"${hemisphere}`,
      );
    }
    let read = 0;
    for (const cell of cells)
      for (const axis of ['lat', 'lon'] as const) {
        const value = parseDegreeSymbols(cell, 0, cell.length, 46, axis === 'lat');
        const reference = parseCoordinate(cell, axis);
        if (Number.isNaN(value)) continue;
        read++;
        // out-of-range values are left to the general path by the fast reader's own range check
        if (!reference.ok) expect(reference.code).toMatch(/out-of-range/);
        else expect(value).toBe(reference.deg);
      }
    expect(read).toBeGreaterThan(3_000);
    expect(parseDegreeSymbols(`59°01.23457'N`, 0, 13, 46, true)).toBeCloseTo(59 + 1.23457 / 60, 12);
  });

  it('leaves to the general path what it would reject or read differently', () => {
    for (const cell of [
      `59°01.'N`, // a decimal mark without digits
      `59°60.0'N`, // minutes of 60
      `59°59'60"N`, // seconds of 60
      `59.5°01'N`, // decimals before the last component
      `59°01.5'02"N`,
      `-59°01.2'N`, // a sign with a hemisphere letter
      `59°+1.5'N`,
      `59°01.5'E`, // E on a latitude
      `59 01.5 N`, // spaces: the general path reads these
      `°01.5'N`,
      `59°'N`,
      `59°01.5'`,
    ])
      expect(parseDegreeSymbols(cell, 0, cell.length, 46, true), cell).toBeNaN();
  });
});

describe('FastCsvRowReader', () => {
  it('reads quoted degrees-minutes-seconds cells as the general path does, and leaves other quoted fields to it', async () => {
    const { readLog } = await import('./read-log.js');
    const text = [
      'time_utc,lat,lon,depth_m',
      `2026-01-01T00:00:00Z,"59°01'14.074""N","005°28'07.407""E",3`,
      `2026-01-01T00:00:01Z,"59°01.5'N","5°28.1'E","4"`,
      `2026-01-01T00:00:02Z,"-59°01.5'N","5°28.1'E",4`,
      // a lone quote inside a quoted field: not a DMS cell the fast path reads
      `2026-01-01T00:00:03Z,"59°01'14.074"N","005°28'07""E",3`,
      '',
    ].join('\n');
    const { tracks, rejections } = readLog({ fileName: 'quoted.csv', content: text });
    const track = tracks[0];
    expect(track?.length).toBe(2);
    expect(track?.columns.latDeg[0]).toBe(59 + 1 / 60 + 14.074 / 3600);
    expect(track?.columns.lonDeg[0]).toBe(5 + 28 / 60 + 7.407 / 3600);
    expect(track?.columns.depthM[1]).toBe(4);
    expect(rejections.map((r) => [r.line, r.code])).toEqual([
      [4, 'unparsable-coordinate'],
      [5, 'unparsable-coordinate'],
    ]);
  });
});
