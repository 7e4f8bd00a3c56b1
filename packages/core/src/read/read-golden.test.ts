import { existsSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { FIX_COLUMN_NAMES, getFix } from '../model/track.js';
import type { LogReadResult, ReadOptions } from './log-read-result.js';
import { readLogAndValidate } from './read-log.js';

// Golden cases: fixtures/read/in/<case>.<ext> (+ <case>.options.json) against fixtures/read/out/<case>.json.
// Regenerate on purpose with UPDATE_GOLDEN=1 and check every changed file by hand before committing.
const IN = new URL('../../../../fixtures/read/in/', import.meta.url);
const OUT = new URL('../../../../fixtures/read/out/', import.meta.url);
const update = process.env.UPDATE_GOLDEN === '1';

/** Rounds numbers to 7 decimals (about 1 cm in latitude), writes times as ISO 8601 and sorts keys. */
function stable(value: unknown): unknown {
  if (typeof value === 'number') return Number.isFinite(value) ? Number(value.toFixed(7)) : String(value);
  if (Array.isArray(value)) return value.map(stable);
  if (value !== null && typeof value === 'object') {
    const out: Record<string, unknown> = {};
    for (const key of Object.keys(value).sort()) out[key] = stable((value as Record<string, unknown>)[key]);
    return out;
  }
  return value;
}

function iso(timeMs: number): string | null {
  return Number.isFinite(timeMs) ? new Date(timeMs).toISOString() : null;
}

function toGolden(result: LogReadResult): string {
  const view = {
    format: result.format,
    dialect: result.dialect,
    rowCount: result.rowCount,
    nonFixRowCount: result.nonFixRowCount,
    notes: result.notes,
    rejections: result.rejections,
    columnReport: result.columnReport ?? null,
    waypoints: result.waypoints.map((w) => ({ ...w, time: iso(w.timeMs), timeMs: undefined })),
    tracks: result.tracks.map((t) => ({
      id: t.id,
      role: t.role,
      name: t.name ?? null,
      provenance: t.provenance,
      segmentStarts: t.segmentStarts,
      fixes: Array.from({ length: t.length }, (_, i) => {
        const { timeMs, ...rest } = getFix(t, i);
        return { time: iso(timeMs), line: t.sourceLines[i], ...rest };
      }),
    })),
  };
  return `${JSON.stringify(stable(JSON.parse(JSON.stringify(view))), null, 2)}\n`;
}

const cases = readdirSync(IN)
  .filter((f) => !f.endsWith('.options.json') && !f.endsWith('.md'))
  .sort();

describe('readLogAndValidate (golden fixtures)', () => {
  it('has fixtures', () => {
    expect(cases.length).toBeGreaterThan(20);
  });
  for (const file of cases) {
    const name = file.replace(/\.[^.]+$/, '');
    it(`${file}`, async () => {
      const optionsFile = new URL(`${name}.options.json`, IN);
      const options: ReadOptions = existsSync(optionsFile) ? JSON.parse(readFileSync(optionsFile, 'utf8')) : {};
      const bytes = new Uint8Array(readFileSync(new URL(file, IN)));
      const result = await readLogAndValidate({ fileName: file, content: bytes }, options);
      // Invariant: every source row is a fix, a waypoint, a rejection or a documented non-fix row.
      const fixes = result.tracks.reduce((sum, t) => sum + t.length, 0);
      expect(result.rowCount).toBe(fixes + result.waypoints.length + result.rejections.length + result.nonFixRowCount);
      // Invariant: every fix has a finite position in range, and a time unless it is a route point.
      for (const track of result.tracks) {
        for (const name of FIX_COLUMN_NAMES) expect(track.columns[name].length).toBe(track.length);
        for (let i = 0; i < track.length; i++) {
          expect(Math.abs(track.columns.latDeg[i] as number)).toBeLessThanOrEqual(90);
          expect(Math.abs(track.columns.lonDeg[i] as number)).toBeLessThanOrEqual(180);
        }
      }
      const golden = toGolden(result);
      const outFile = new URL(`${name}.json`, OUT);
      if (update) writeFileSync(outFile, golden);
      expect(existsSync(outFile), `missing golden ${name}.json (run with UPDATE_GOLDEN=1 and check it by hand)`).toBe(
        true,
      );
      expect(golden).toBe(readFileSync(outFile, 'utf8'));
    });
  }
});
