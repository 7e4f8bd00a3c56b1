import type { Finding, Severity, Verdict } from './finding.js';

const SEVERITY_RANK: Record<Severity, number> = { info: 0, warn: 1, fail: 2 };

/** Orders severities: negative when `a` is milder than `b`. */
export function compareSeverity(a: Severity, b: Severity): number {
  return SEVERITY_RANK[a] - SEVERITY_RANK[b];
}

/**
 * The verdict rule: `fail` when any finding is `fail`, else `warn` when any is `warn`, else `pass`
 * (`info` findings never change the verdict). Documented in packages/core/src/audit/README.md.
 */
export function decideVerdict(findings: readonly Finding[]): Verdict {
  let worst = 0;
  for (const finding of findings) worst = Math.max(worst, SEVERITY_RANK[finding.severity]);
  return worst === 2 ? 'fail' : worst === 1 ? 'warn' : 'pass';
}
