import { existsSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readLog } from '../read/read-log.js';
import { formatResolveResult } from './format-resolve-result.js';
import { resolveTrack } from './resolve-track.js';

// Golden fixtures: fixtures/resolve/in/<case>.csv with <case>.options.json ({ setup }) →
// fixtures/resolve/out/<case>.json. Regenerate on purpose with UPDATE_GOLDEN=1 and check by hand.
const FIXTURES = join(import.meta.dirname, '../../../../fixtures/resolve');
const UPDATE = process.env.UPDATE_GOLDEN === '1';

/** JSON with sorted keys and a trailing newline, so goldens diff cleanly. */
function stableJson(value: unknown): string {
  const sort = (v: unknown): unknown => {
    if (Array.isArray(v)) return v.map(sort);
    if (v !== null && typeof v === 'object')
      return Object.fromEntries(
        Object.keys(v)
          .sort()
          .map((k) => [k, sort((v as Record<string, unknown>)[k])]),
      );
    return v;
  };
  return `${JSON.stringify(sort(value), null, 2)}\n`;
}

const cases = readdirSync(join(FIXTURES, 'in'))
  .filter((f) => f.endsWith('.csv'))
  .map((f) => f.replace(/\.csv$/, ''))
  .sort();

describe('resolveTrack golden fixtures', () => {
  it('has cases', () => {
    expect(cases.length).toBeGreaterThanOrEqual(4);
  });

  it.each(cases)('%s', (name) => {
    const content = readFileSync(join(FIXTURES, 'in', `${name}.csv`));
    const options = JSON.parse(readFileSync(join(FIXTURES, 'in', `${name}.options.json`), 'utf8')) as {
      setup: unknown;
    };
    const read = readLog({ fileName: `${name}.csv`, content });
    expect(read.rejections).toEqual([]);
    const vehicle = read.tracks.filter((t) => t.role === 'vehicle');
    expect(vehicle).toHaveLength(1);
    const track = vehicle[0];
    if (track === undefined) return;
    const result = resolveTrack(track, options.setup);

    // Invariants: every input fix is re-solved or rejected; times keep increasing.
    expect(result.comparison.resolvedCount + result.comparison.rejectedCount).toBe(track.length);
    const times = result.track.columns.timeMs;
    for (let i = 1; i < times.length; i++) expect(times[i] as number).toBeGreaterThan(times[i - 1] as number);

    // The audit verdicts are left out: they belong to the audit stage, whose goldens pin them;
    // resolve-track.test.ts checks that the comparison carries them.
    const { audit: _audit, ...report } = formatResolveResult(result, { fixes: true });
    const text = stableJson(report);
    const golden = join(FIXTURES, 'out', `${name}.json`);
    if (UPDATE) writeFileSync(golden, text);
    expect(existsSync(golden), `missing golden ${golden} (run with UPDATE_GOLDEN=1 on purpose)`).toBe(true);
    expect(text).toBe(readFileSync(golden, 'utf8'));
  });
});
