import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { auditTrack, BatchReportSchema, DiveReportSchema, readLog, resolveAuditProfile } from '@leadline/core';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import type { CliIo } from '../io.js';
import { main } from '../main.js';
import { type AuditCliOptions, type AuditFileReport, runAudit } from './audit.js';

const FIXTURES = join(import.meta.dirname, '../../../../fixtures/audit');
const IN = join(FIXTURES, 'in');
const UPDATE = process.env.UPDATE_GOLDEN === '1';

function capture(): CliIo & { out: () => string; err: () => string } {
  const out: string[] = [];
  const err: string[] = [];
  return {
    isTty: false,
    stdout: (t) => out.push(t),
    stderr: (t) => err.push(t),
    out: () => out.join(''),
    err: () => err.join(''),
  };
}

const base: AuditCliOptions = { failOn: 'fail', jobs: 1, json: true, quiet: false, progress: false, force: false };

let dir: string;
beforeEach(() => {
  dir = mkdtempSync(join(tmpdir(), 'leadline-audit-'));
});
afterEach(() => rmSync(dir, { recursive: true, force: true }));

describe('runAudit', () => {
  it('prints the documented JSON per input, agrees with the core audit, and matches its golden', async () => {
    const io = capture();
    const code = await runAudit(['clean-patrol.csv', 'clock-glitches.csv', 'multipath-outliers.csv'], base, io, IN);
    expect(io.err()).toBe('');
    expect(code).toBe(1); // clock-glitches fails and --fail-on defaults to fail
    const reports = JSON.parse(io.out()) as AuditFileReport[];
    expect(reports.map((r) => [r.file, r.verdict])).toEqual([
      ['clean-patrol.csv', 'pass'],
      ['clock-glitches.csv', 'fail'],
      ['multipath-outliers.csv', 'warn'],
    ]);
    for (const r of reports) for (const d of r.dives) expect(DiveReportSchema.safeParse(d).error).toBeUndefined();
    // the same findings as the core gives for the same file
    const read = readLog({ fileName: 'clock-glitches.csv', content: readFileSync(join(IN, 'clock-glitches.csv')) });
    const audit = auditTrack(read.tracks[0] as never, { profile: resolveAuditProfile('inspection-rov') });
    expect(reports[1]?.findings.map((f) => [f.check, f.severity, f.message])).toEqual(
      audit.findings.map((f) => [f.check, f.severity, f.message]),
    );
    for (const f of reports[1]?.findings ?? []) expect(f.startTime).toMatch(/^2026-06-03T08:\d\d:\d\d\.\d{3}Z$/);
    const golden = join(FIXTURES, 'out', 'cli-audit.json');
    if (UPDATE) writeFileSync(golden, io.out());
    expect(io.out()).toBe(readFileSync(golden, 'utf8'));
  });

  it('exits 0 with --fail-on never, 1 with --fail-on warn on a warning dive', async () => {
    expect(await runAudit(['multipath-outliers.csv'], { ...base, failOn: 'never' }, capture(), IN)).toBe(0);
    expect(await runAudit(['multipath-outliers.csv'], { ...base, failOn: 'warn' }, capture(), IN)).toBe(1);
    expect(await runAudit(['clean-patrol.csv'], { ...base, failOn: 'warn' }, capture(), IN)).toBe(0);
  });

  it('writes per-dive reports, a linked batch report and the run manifest under --out, and refuses to overwrite', async () => {
    const out = join(dir, 'qc');
    const options = { ...base, json: false, quiet: true, report: 'html' as const, out };
    const code = await runAudit(['clean-patrol.csv', 'multipath-outliers.csv'], options, capture(), IN);
    expect(code).toBe(0);
    const html = readFileSync(join(out, 'multipath-outliers.audit.html'), 'utf8');
    expect(html).toContain('position-jump');
    expect(html).not.toMatch(/<script|src="http/);
    const batch = readFileSync(join(out, 'audit-report.html'), 'utf8');
    expect(batch).toContain('href="clean-patrol.audit.html"');
    expect(batch.match(/<svg /g)).toHaveLength(4); // plan and depth per dive
    expect(existsSync(join(out, 'leadline-run.json'))).toBe(true);
    const again = capture();
    expect(await runAudit(['clean-patrol.csv'], options, again, IN)).toBe(3);
    expect(again.err()).toContain('add --force');
  });

  it('writes a schema-valid JSON batch report', async () => {
    const out = join(dir, 'json');
    await runAudit(
      ['clean-patrol.csv', 'clock-glitches.csv'],
      { ...base, json: false, quiet: true, report: 'json', out },
      capture(),
      IN,
    );
    const batch = JSON.parse(readFileSync(join(out, 'audit-report.json'), 'utf8'));
    expect(BatchReportSchema.safeParse(batch).error).toBeUndefined();
    expect(batch.verdictCounts).toEqual({ pass: 1, warn: 0, fail: 1 });
  });

  it('uses the setup and user profiles from the config file, and names a bad key', async () => {
    writeFileSync(
      join(dir, 'leadline.config.json'),
      JSON.stringify({
        profiles: { 'harbour-rov': { extends: 'inspection-rov', surfaceDriftWarnM: 30, surfaceDriftFailM: 40 } },
      }),
    );
    writeFileSync(join(dir, 'drift.csv'), readFileSync(join(IN, 'surface-drift.csv')));
    const strict = capture();
    await runAudit(['drift.csv'], { ...base, setup: '{"surfaceStationary":true}' }, strict, dir);
    expect((JSON.parse(strict.out()) as AuditFileReport[])[0]?.findings.map((f) => f.check)).toEqual(['surface-drift']);
    const lenient = capture();
    await runAudit(
      ['drift.csv'],
      { ...base, profile: 'harbour-rov', setup: '{"surfaceStationary":true}' },
      lenient,
      dir,
    );
    expect((JSON.parse(lenient.out()) as AuditFileReport[])[0]?.findings).toEqual([]);
    writeFileSync(
      join(dir, 'leadline.config.json'),
      JSON.stringify({ profiles: { bad: { extends: 'diver', maxSpeedMps: 'fast' } } }),
    );
    const bad = capture();
    expect(await runAudit(['drift.csv'], base, bad, dir)).toBe(2);
    expect(bad.err()).toContain('profiles.bad.maxSpeedMps');
  });

  it('reports a usage error for an unknown profile and an unreadable input with exit 3', async () => {
    const io = capture();
    expect(await runAudit(['clean-patrol.csv'], { ...base, profile: 'glider' }, io, IN)).toBe(2);
    expect(io.err()).toContain('valid: inspection-rov, work-rov, diver, towed-body');
    writeFileSync(join(dir, 'empty.csv'), '');
    writeFileSync(join(dir, 'ok.csv'), readFileSync(join(IN, 'clean-patrol.csv')));
    const mixed = capture();
    expect(await runAudit(['empty.csv', 'ok.csv'], base, mixed, dir)).toBe(3);
    const reports = JSON.parse(mixed.out()) as AuditFileReport[];
    expect(reports.map((r) => r.ok)).toEqual([false, true]);
    expect(mixed.err()).toContain('empty.csv');
  });
});

describe('leadline audit (through main)', () => {
  it('has --help with examples', async () => {
    const io = capture();
    await main(['audit', '--help'], io);
    expect(io.out()).toContain('Examples:');
    expect(io.out()).toContain('--fail-on');
  });
});
