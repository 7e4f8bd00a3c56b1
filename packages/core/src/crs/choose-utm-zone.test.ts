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

  it('refuses a track with no positions', () => {
    expect(() => chooseUtmZone([Number.NaN], [Number.NaN])).toThrow(/no fix has a position/);
  });
});
