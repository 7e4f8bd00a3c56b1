import type { AuditContext } from './audit-context.js';

/**
 * A per-fix buffer of measurements, every entry `NaN`, shared by the checks of one audit (they run
 * one after the other and hand their measurements to `findingsFromRuns` before the next starts), so
 * a million-fix audit allocates it once instead of once per check.
 */
export function measuredBuffer(context: AuditContext): Float64Array {
  let buffer = context.cache.measured;
  if (buffer === undefined || buffer.length !== context.n) {
    buffer = new Float64Array(context.n);
    context.cache.measured = buffer;
  }
  return buffer.fill(Number.NaN);
}
