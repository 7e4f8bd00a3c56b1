import { describe, expect, it } from 'vitest';
import { chooseUtmZone, utmZoneOf } from './choose-utm-zone.js';

describe('utmZoneOf', () => {
  it('follows the 6° zones (zone 31 starts at 0°E, zone 1 at 180°W)', () => {
    expect(utmZoneOf(50, 9)).toBe(32);
    expect(utmZoneOf(0, -180)).toBe(1);
    expect(utmZoneOf(0, 179.99)).toBe(60);
    expect(utmZoneOf(-40, 180)).toBe(1);
  });

  it('widens zone 32 over south-west Norway, 56°N–64°N, 3°E–12°E (band V exception)', () => {
    expect(utmZoneOf(60, 4)).toBe(32);
    expect(utmZoneOf(55.9, 4)).toBe(31);
    expect(utmZoneOf(64, 4)).toBe(31);
    expect(utmZoneOf(60, 2.9)).toBe(31);
  });

  it('uses only zones 31, 33, 35, 37 over Svalbard, 72°N–84°N (band X exception)', () => {
    expect(utmZoneOf(78, 8.9)).toBe(31);
    expect(utmZoneOf(78, 9)).toBe(33);
    expect(utmZoneOf(78, 20.9)).toBe(33);
    expect(utmZoneOf(78, 21)).toBe(35);
    expect(utmZoneOf(78, 33)).toBe(37);
    expect(utmZoneOf(78, 41.9)).toBe(37);
    expect(utmZoneOf(71.9, 10)).toBe(32);
  });

  it('refuses latitudes outside 80°S–84°N', () => {
    expect(() => utmZoneOf(85, 0)).toThrow(/80°S to 84°N/);
    expect(() => utmZoneOf(Number.NaN, 0)).toThrow();
  });
});

describe('chooseUtmZone', () => {
  it('chooses from the track centre and gives the WGS 84 / UTM code', () => {
    expect(chooseUtmZone([60, 60.01], [5.9, 6.1])).toMatchObject({
      zone: 32,
      hemisphere: 'north',
      code: 'EPSG:32632',
      straddles: false,
    });
    expect(chooseUtmZone([-33.9], [151.3])).toMatchObject({ zone: 56, hemisphere: 'south', code: 'EPSG:32756' });
  });

  it('keeps a track that straddles a zone boundary in one zone and says so', () => {
    const choice = chooseUtmZone([50, 50, 50], [8.99, 9.001, 9.02]);
    expect(choice.zone).toBe(32);
    const across = chooseUtmZone([50, 50, 50], [11.999, 12.01, 12.02]);
    expect(across.zone).toBe(33);
    expect(across.straddles).toBe(true);
    expect(across.note).toMatch(/also enters zone 32 but stays in zone 33/);
  });

  it('handles a track across the antimeridian and says so', () => {
    const choice = chooseUtmZone([-17, -17], [179.999, -179.999]);
    expect([1, 60]).toContain(choice.zone);
    expect(choice.straddles).toBe(true);
    expect(choice.note).toMatch(/antimeridian/);
  });

  it('finds the zones a track enters as zone-by-zone over every fix would, near the exceptions too', () => {
    // Small clusters anywhere UTM is defined, many on the Norway and Svalbard exceptions: whether a
    // track straddles, and the note, must not depend on the shortcut taken for a box in one zone.
    let seed = 7;
    const random = () => {
      seed = (seed * 1103515245 + 12345) % 2147483648;
      return seed / 2147483648;
    };
    for (let k = 0; k < 2000; k++) {
      const nearException = k % 2 === 0;
      const lat0 = nearException ? 54 + random() * 29 : -79 + random() * 162;
      const lon0 = nearException ? -2 + random() * 46 : -180 + random() * 360;
      const size = random() < 0.5 ? random() * 0.05 : random() * 4;
      const lat = Array.from({ length: 40 }, () => Math.min(84, lat0 + random() * size));
      const lon = Array.from({ length: 40 }, () => lon0 + random() * size);
      const choice = chooseUtmZone(lat, lon);
      const entered = new Set(lat.map((la, i) => utmZoneOf(la, lon[i] as number)));
      entered.delete(choice.zone);
      expect(choice.straddles, `cluster ${k} at ${lat0}, ${lon0}`).toBe(entered.size > 0);
      if (entered.size > 0) expect(choice.note).toContain([...entered].sort((a, b) => a - b).join(', '));
    }
  });

  it('refuses a track with no positions', () => {
    expect(() => chooseUtmZone([Number.NaN], [Number.NaN])).toThrow(/no fix has a position/);
  });
});
