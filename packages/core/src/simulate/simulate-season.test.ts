import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { utmZoneOf } from '../crs/choose-utm-zone.js';
import { DEMO_SITES, planSeason, simulatePlannedDive, simulateSeason } from './simulate-season.js';
import { LOG_DIALECTS } from './write-dive-logs.js';

function seasonDigest(seed: number): string {
  const hash = createHash('sha256');
  for (const dive of simulateSeason({ seed, dives: 4, diveMinutes: 5 })) {
    for (const file of [...dive.files, dive.truthFile])
      hash.update(file.name).update('\0').update(file.text).update('\0');
  }
  return hash.digest('hex');
}

describe('simulateSeason', () => {
  it('gives the same bytes for the same seed and different bytes for another seed', () => {
    const first = seasonDigest(2026);
    expect(seasonDigest(2026)).toBe(first);
    expect(seasonDigest(2027)).not.toBe(first);
  });

  it('yields each dive with its log files and a truth file naming them', () => {
    const dives = [...simulateSeason({ seed: 9, dives: 2, diveMinutes: 5 })];
    expect(dives).toHaveLength(2);
    for (const dive of dives) {
      const truth = JSON.parse(dive.truthFile.text);
      expect(truth.files.map((f: { name: string }) => f.name)).toEqual(dive.files.map((f) => f.name));
      expect(truth.track.vehicle.timeMs).toHaveLength(dive.dive.truth.vehicle.timeMs.length);
      expect(truth.track.vehicleLogTruthIndex).toEqual(Array.from(dive.dive.vehicleLog.truthIndex));
      expect(Object.keys(truth)).toEqual(Object.keys(truth).sort());
      expect(truth.conventions.join(' ')).toContain('assumed over water sound speed');
      expect(dive.truthFile.name.endsWith('.truth.json')).toBe(true);
    }
  });
});

describe('planSeason', () => {
  const season = planSeason({ seed: 1, dives: 40 });

  it('plans about 40 dives over a few months at three sites in both hemispheres and both sides of Greenwich', () => {
    expect(season).toHaveLength(40);
    const sites = new Set(season.map((d) => d.spec.site.id));
    expect(sites).toEqual(new Set(DEMO_SITES.map((s) => s.id)));
    expect(DEMO_SITES.some((s) => s.originLatDeg < 0)).toBe(true);
    expect(DEMO_SITES.some((s) => s.originLonDeg < 0)).toBe(true);
    const start = season[0]?.spec.startTimeMs ?? 0;
    const end = season.at(-1)?.spec.startTimeMs ?? 0;
    const months = (end - start) / (30 * 86_400_000);
    expect(months).toBeGreaterThan(1.5);
    expect(months).toBeLessThan(6);
  });

  it('puts the Norwegian site where the UTM 32V exception applies (longitude alone would say zone 31)', () => {
    const site = DEMO_SITES.find((s) => s.id === 'skarvholmen');
    expect(Math.floor(((site?.originLonDeg ?? 0) + 180) / 6) + 1).toBe(31);
    expect(utmZoneOf(site?.originLatDeg ?? 0, site?.originLonDeg ?? 0)).toBe(32);
  });

  it('uses every log layout and keeps pattern speeds within the platform limits', () => {
    expect(new Set(season.map((d) => d.dialect))).toEqual(new Set(LOG_DIALECTS));
    for (const d of season)
      expect(d.spec.flight.speedMps).toBeLessThanOrEqual(d.spec.flight.platform.maxSpeedMps * 0.8);
  });

  it('holds a night dive logged in Europe/Oslo local time across the 2026 summer-time change (01:59:59 → 03:00:00)', () => {
    const night = season.find((d) => d.dialect === 'csv-local-time' && d.spec.site.timeZone === 'Europe/Oslo');
    expect(night).toBeDefined();
    if (night === undefined) return;
    // Short enough to stay quick; it still spans 02:00 CET, when clocks go to 03:00 CEST (EU rule, last Sunday of March 01:00 UTC).
    const shortNight = { ...night, spec: { ...night.spec, flight: { ...night.spec.flight, durationS: 1800 } } };
    const [vehicle] = simulatePlannedDive(shortNight).files;
    expect(vehicle?.timeZone).toBe('Europe/Oslo');
    const times = (vehicle?.text ?? '').split('\n').map((line) => line.slice(0, 19));
    const before = times.indexOf('2026-03-29 01:59:59');
    expect(before).toBeGreaterThan(0);
    expect(times[before + 1]).toBe('2026-03-29 03:00:00');
    expect(times.some((t) => t.startsWith('2026-03-29 02:'))).toBe(false);
  });

  it('writes every dive in one layout when asked, and refuses an unknown layout', () => {
    expect(new Set(planSeason({ seed: 1, dives: 12, dialect: 'nmea' }).map((d) => d.dialect))).toEqual(
      new Set(['nmea']),
    );
    expect(() => planSeason({ seed: 1, dives: 2, dialect: 'xls' as never })).toThrow(/unknown log layout xls/);
  });

  it('plans seasons that run past the bundled magnetic model (declination held at its last modelled value)', () => {
    const long = planSeason({ seed: 1, dives: 900, diveMinutes: 30 });
    expect(long.at(-1)?.spec.startTimeMs).toBeGreaterThan(Date.UTC(2029, 10, 13));
    expect(Number.isFinite(long.at(-1)?.spec.trueSetup.declinationDeg)).toBe(true);
  });

  it('refuses fewer than one dive', () => {
    expect(() => planSeason({ seed: 1, dives: 0 })).toThrow(/1 or more/);
  });
});
