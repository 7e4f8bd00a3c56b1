import { describe, expect, it } from 'vitest';
import { parseCoordinate } from './parse-coordinate.js';
import { parseDegreeSymbols } from './parse-csv-row-fast.js';

describe('parseDegreeSymbols', () => {
  it('gives the value parseCoordinate gives, or NaN to leave the cell to the general path', () => {
    const cells = [`59°01.23457'N`, `005°28'07.407"E`, `59°1'1"S`, `0°00.0'S`, `180°00'00"W`, `42°52.9260'S`];
    for (let i = 0; i < 20_000; i++) {
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
    expect(read).toBeGreaterThan(15_000);
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
