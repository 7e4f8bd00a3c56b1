import { existsSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { readLog } from '../read/read-log.js';
import { buildDiveReport } from '../report/build-dive-report.js';
import { formatReportJson } from '../report/format-report-json.js';
import { DiveReportSchema } from '../report/report-schemas.js';
import type { AuditSetup } from './audit-setup.js';
import { auditTrack } from './audit-track.js';
import { resolveAuditProfile } from './resolve-audit-profile.js';

const stage = fileURLToPath(new URL('../../../../fixtures/audit/', import.meta.url));
const cases = readdirSync(join(stage, 'in')).filter((f) => !f.endsWith('.options.json'));

// Golden dive reports for fixtures/audit/in/<case>: every vehicle track of the log audited with
// the case's options ({ profile, setup }), reported as JSON. UPDATE_GOLDEN=1 rewrites them.
describe('auditTrack (golden reports)', () => {
  for (const file of cases) {
    const name = file.replace(/\.[^.]+$/, '');
    it(`${name}`, () => {
      const optionsPath = join(stage, 'in', `${name}.options.json`);
      const options = existsSync(optionsPath)
        ? (JSON.parse(readFileSync(optionsPath, 'utf8')) as { profile?: string; setup?: AuditSetup })
        : {};
      const read = readLog({ fileName: file, content: readFileSync(join(stage, 'in', file)) });
      expect(read.rejections).toEqual([]);
      const reports = read.tracks
        .filter((t) => t.role === 'vehicle')
        .map((track) => {
          const audit = auditTrack(track, {
            profile: resolveAuditProfile(options.profile ?? 'inspection-rov'),
            setup: options.setup ?? {},
          });
          const report = buildDiveReport({ file, track, audit });
          // invariants: schema-valid, spans inside the track, flagged count agrees with the flags
          expect(DiveReportSchema.safeParse(report).error).toBeUndefined();
          for (const f of report.findings) expect(f.endIndex).toBeLessThan(track.length);
          expect(report.flaggedCount).toBe([...audit.flags].filter((x) => x !== 0).length);
          return report;
        });
      const text = formatReportJson(reports);
      const goldenPath = join(stage, 'out', `${name}.json`);
      if (process.env.UPDATE_GOLDEN === '1') writeFileSync(goldenPath, text);
      expect(
        existsSync(goldenPath),
        `missing golden ${goldenPath} (run with UPDATE_GOLDEN=1 and check it by hand)`,
      ).toBe(true);
      expect(text).toBe(readFileSync(goldenPath, 'utf8'));
    });
  }
});
