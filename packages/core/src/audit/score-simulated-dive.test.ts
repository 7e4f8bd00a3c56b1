import { describe, expect, it } from 'vitest';
import { simulateDive } from '../simulate/simulate-dive.js';
import { planSeason } from '../simulate/simulate-season.js';
import { type SimulatedDiveScore, scoreSimulatedDive } from './score-simulated-dive.js';

interface SeasonScore {
  injected: number;
  found: number;
  cleanFixes: number;
  flaggedClean: number;
  rmsLogged: number;
  rmsSmoothed: number;
  rmsLoggedClean: number;
  rmsSmoothedClean: number;
  kinds: Set<string>;
}

function scoreSeason(dives: number, correctSetup: boolean): SeasonScore {
  const total: SeasonScore = {
    injected: 0,
    found: 0,
    cleanFixes: 0,
    flaggedClean: 0,
    rmsLogged: 0,
    rmsSmoothed: 0,
    rmsLoggedClean: 0,
    rmsSmoothedClean: 0,
    kinds: new Set(),
  };
  let fixes = 0;
  for (const planned of planSeason({ seed: 2026, dives, diveMinutes: 15 })) {
    let dive = simulateDive(planned.spec);
    // the same dive, logged with the true setup: what is left is noise and faults, the smoother's business
    if (correctSetup) dive = simulateDive({ ...planned.spec, loggedSetup: dive.truth.trueSetup });
    const s: SimulatedDiveScore = scoreSimulatedDive(dive);
    total.injected += s.injected;
    total.found += s.found;
    total.cleanFixes += s.cleanFixes;
    total.flaggedClean += s.flaggedCleanFixes;
    total.rmsLogged += s.rmsLoggedM ** 2 * s.fixes;
    total.rmsSmoothed += s.rmsSmoothedM ** 2 * s.fixes;
    total.rmsLoggedClean += s.rmsLoggedCleanM ** 2 * s.cleanFixes;
    total.rmsSmoothedClean += s.rmsSmoothedCleanM ** 2 * s.cleanFixes;
    for (const kind of Object.keys(s.byKind)) total.kinds.add(kind);
    fixes += s.fixes;
  }
  total.rmsLogged = Math.sqrt(total.rmsLogged / fixes);
  total.rmsSmoothed = Math.sqrt(total.rmsSmoothed / fixes);
  total.rmsLoggedClean = Math.sqrt(total.rmsLoggedClean / total.cleanFixes);
  total.rmsSmoothedClean = Math.sqrt(total.rmsSmoothedClean / total.cleanFixes);
  return total;
}

// Scored against the simulator's truth (issue 6 item 6). Figures measured on this 30-dive season
// when written are in packages/core/src/audit/README.md; the floors sit a little below them.
describe('scoreSimulatedDive', () => {
  it('finds at least 97 % of injected faults and flags under 0.25 % of clean fixes', () => {
    const season = scoreSeason(30, false);
    expect(season.kinds).toEqual(
      new Set(['multipath-outlier', 'dropout', 'repeated-time', 'backwards-time', 'surface-drift']),
    );
    expect(season.injected).toBeGreaterThan(100);
    expect(season.found / season.injected).toBeGreaterThanOrEqual(0.97);
    expect(season.flaggedClean / season.cleanFixes).toBeLessThanOrEqual(0.0025);
  }, 60_000);

  it('cuts the RMS horizontal error against the true track by more than 70 % (more than 50 % on clean fixes alone)', () => {
    const season = scoreSeason(30, true);
    expect(season.rmsSmoothed).toBeLessThan(season.rmsLogged * 0.3);
    expect(season.rmsSmoothedClean).toBeLessThan(season.rmsLoggedClean * 0.5);
  }, 60_000);
});
