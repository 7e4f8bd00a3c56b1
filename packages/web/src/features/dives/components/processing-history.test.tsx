import { cleanup, render, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import type { DiveResultView } from '../api/get-dive-history';
import type { DiveRunView } from '../api/get-log-runs';
import { describeSetup, ProcessingHistory } from './processing-history';

afterEach(cleanup);

const archive = { organisationId: 'o', projectId: 'p', logId: 'l', resultId: 'r2', logFileName: 'x.csv' };
const run = (id: string, fields: Partial<DiveRunView>): DiveRunView => ({
  id,
  diveId: 'd',
  kind: 'reprocess',
  status: 'done',
  reason: null,
  auditProfile: 'inspection-rov',
  resolveSetup: null,
  auditSetup: {},
  createdAt: '2026-06-14T10:00:00.000Z',
  finishedAt: null,
  ...fields,
});
const result = (id: string, runId: string, fields: Partial<DiveResultView>): DiveResultView => ({
  id,
  runId,
  verdict: 'pass',
  auditProfile: 'inspection-rov',
  resolveSetup: null,
  auditSetup: {},
  flaggedCount: 0,
  findingCounts: {},
  resolveComparison: null,
  createdAt: '2026-06-14T10:00:00.000Z',
  ...fields,
});

describe('ProcessingHistory', () => {
  it('lists every run of the dive with its parameters and outcome, the latest result marked as the default', () => {
    const setup = { name: 'after CTD cast', headingOffset: { valueDeg: 1.5 }, declination: { method: 'wmm' } };
    render(
      <ProcessingHistory
        diveId="d"
        archive={archive}
        runs={[
          run('run-4', { status: 'failed', reason: 'unknown profile "sled"', auditProfile: 'sled' }),
          run('run-3', { auditProfile: 'work-rov', resolveSetup: setup }),
          run('run-other', { diveId: 'another-dive' }),
          run('run-1', { kind: 'process', diveId: null, createdAt: '2026-06-14T09:00:00.000Z' }),
        ]}
        results={[
          result('r2', 'run-3', {
            verdict: 'warn',
            auditProfile: 'work-rov',
            resolveSetup: setup,
            flaggedCount: 12,
            resolveComparison: {
              resolvedCount: 1000,
              rejectedCount: 0,
              movedM: { comparedCount: 1000, medianM: 1.234, p95M: 2, maxM: 3.456 },
            },
          }),
          result('r1', 'run-1', {}),
        ]}
      />,
    );
    const rows = within(screen.getByRole('table')).getAllByRole('row').slice(1);
    expect(rows).toHaveLength(3);
    expect(rows[0]?.textContent).toMatch(/Failed: unknown profile "sled"/);
    expect(rows[1]?.textContent).toMatch(/Reprocessed \(this dive\).*Default — shown above/);
    expect(rows[1]?.textContent).toMatch(
      /Re-solved \(after CTD cast\): heading offset 1\.5°; declination from the World Magnetic Model/,
    );
    expect(rows[1]?.textContent).toMatch(/median 1\.23 m, max 3\.46 m/);
    expect(rows[1]?.textContent).toMatch(/12 fixes flagged/);
    expect(rows[2]?.textContent).toMatch(/Read and audited.*Logged positions/);
    expect(rows[2]?.textContent).not.toMatch(/Default/);
    const report = within(rows[2] as HTMLElement).getAllByRole('link')[0];
    expect(report?.getAttribute('href')).toBe(
      '/api/v1/organisations/o/projects/p/dives/d/report?format=json&resultId=r1',
    );
  });
});

describe('describeSetup', () => {
  it('names a temperature/salinity sound speed, a lever arm and a fixed surface position', () => {
    expect(
      describeSetup({
        soundSpeed: { loggedMps: 1500, water: { method: 'unesco-1983', temperatureC: 8, salinityPsu: 34 } },
        leverArm: { forwardM: 1, starboardM: 0, downM: 2 },
        surfacePosition: { method: 'fixed', latDeg: 59.9, lonDeg: 10.7 },
      }),
    ).toBe(
      'Re-solved (re-solve setup): sound speed from 8 °C, 34 PSU; lever arm 1 / 0 / 2 m; fixed surface position 59.9, 10.7',
    );
    expect(describeSetup(null)).toBe('Logged positions');
  });
});
