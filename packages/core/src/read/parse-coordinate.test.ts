import { describe, expect, it } from 'vitest';
import { parseCoordinate } from './parse-coordinate.js';

// Expected values are worked by hand: degrees + minutes/60 + seconds/3600, negative for S and W.
describe('parseCoordinate', () => {
  it('reads decimal degrees with a sign, a decimal comma, a degree sign or a hemisphere letter', () => {
    expect(parseCoordinate('59.12', 'lat')).toEqual({ ok: true, deg: 59.12, form: 'dd' });
    expect(parseCoordinate('-5.21', 'lon')).toEqual({ ok: true, deg: -5.21, form: 'dd' });
    expect(parseCoordinate('59,12', 'lat')).toMatchObject({ ok: true, deg: 59.12 });
    expect(parseCoordinate('59.12°N', 'lat')).toMatchObject({ ok: true, deg: 59.12 });
    expect(parseCoordinate('W 5.21', 'lon')).toMatchObject({ ok: true, deg: -5.21 });
  });

  it('reads degrees and decimal minutes', () => {
    expect(parseCoordinate('59 07.2000 N', 'lat')).toMatchObject({ ok: true, form: 'ddm' });
    expect((parseCoordinate('59 07.2000 N', 'lat') as { deg: number }).deg).toBeCloseTo(59.12, 12);
    expect((parseCoordinate("33°51.6'S", 'lat') as { deg: number }).deg).toBeCloseTo(-33.86, 12);
    expect((parseCoordinate('005 12,6 W', 'lon') as { deg: number }).deg).toBeCloseTo(-5.21, 12);
  });

  it('reads degrees, minutes and seconds', () => {
    const value = parseCoordinate(`151°12'18.0"E`, 'lon');
    expect(value).toMatchObject({ ok: true, form: 'dms' });
    expect((value as { deg: number }).deg).toBeCloseTo(151.205, 12);
    expect((parseCoordinate('59 07 12.36 N', 'lat') as { deg: number }).deg).toBeCloseTo(59.1201, 12);
    expect((parseCoordinate('-59:07:12', 'lat') as { deg: number }).deg).toBeCloseTo(-59.12, 12);
  });

  it('refuses what is not a coordinate of the axis', () => {
    expect(parseCoordinate('59.12 E', 'lat')).toMatchObject({ ok: false, code: 'unparsable-coordinate' });
    expect(parseCoordinate('59 61.0 N', 'lat')).toMatchObject({ ok: false, code: 'unparsable-coordinate' });
    expect(parseCoordinate('59.5 07 N', 'lat')).toMatchObject({ ok: false, code: 'unparsable-coordinate' });
    expect(parseCoordinate('-59.1 S', 'lat')).toMatchObject({ ok: false, code: 'unparsable-coordinate' });
    expect(parseCoordinate('abc', 'lon')).toMatchObject({ ok: false, code: 'unparsable-coordinate' });
    expect(parseCoordinate('0x1F', 'lon')).toMatchObject({ ok: false, code: 'unparsable-coordinate' });
    expect(parseCoordinate('NaN', 'lat')).toMatchObject({ ok: false, code: 'non-finite-value' });
    expect(parseCoordinate('-Infinity', 'lon')).toMatchObject({ ok: false, code: 'non-finite-value' });
    expect(parseCoordinate('90.0001', 'lat')).toMatchObject({ ok: false, code: 'latitude-out-of-range' });
    expect(parseCoordinate('180 30 W', 'lon')).toMatchObject({ ok: false, code: 'longitude-out-of-range' });
  });
});
