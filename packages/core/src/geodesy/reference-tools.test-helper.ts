/**
 * Test-only access to the general-purpose reference programs the geodesy checks compare with:
 * PROJ `cs2cs`, GeographicLib `GeodSolve` and `Planimeter`, libxml2 `xmllint` (Debian packages
 * proj-bin, geographiclib-tools, libxml2-utils; `npm test` installs them). Each check feeds all
 * its points to one run of the tool. Outside CI a missing tool skips the check and says so; in CI
 * the check runs and fails.
 */
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';

/** Whether a check needing `path` should run: the tool exists, or we are in CI (where missing must fail). */
export function shouldRunWith(path: string): boolean {
  if (existsSync(path)) return true;
  if (process.env.CI) return true;
  console.error(
    `skipping the ${path} cross-check: the tool is not installed here (npm test installs it; CI always runs it)`,
  );
  return false;
}

/** Runs a reference tool once with all input on stdin; throws with its stderr when it fails. */
export function runReferenceTool(path: string, args: readonly string[], input: string): string {
  const result = spawnSync(path, args, { input, encoding: 'utf8', maxBuffer: 64 * 1024 * 1024 });
  if (result.error) throw result.error;
  if (result.status !== 0) throw new Error(`${path} ${args.join(' ')} failed (${result.status}): ${result.stderr}`);
  return result.stdout;
}

/** A small seeded pseudo-random generator (mulberry32) so cross-checks are repeatable. */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Degrees from degrees, minutes, seconds (sign from the degrees, or `negative`). */
export function dms(deg: number, min: number, sec: number, negative = false): number {
  const value = Math.abs(deg) + min / 60 + sec / 3600;
  return negative || deg < 0 ? -value : value;
}
