import type { Verdict } from '../audit/finding.js';
import { LEADLINE_VERSION } from '../version.js';
import type { DiveReport } from './build-dive-report.js';
import { VERDICT_RULE } from './build-dive-report.js';
import { SAFETY_CAUTION } from './safety-caution.js';

/** One dive's line in a batch report. */
export interface BatchDiveLine {
  file: string;
  trackId: string;
  verdict: Verdict;
  fixCount: number;
  flaggedCount: number;
  findingCounts: DiveReport['findingCounts'];
  startTime: string | null;
  durationS: number | null;
  /** Where the dive's own report is, relative to the batch report, when the caller wrote one. */
  href?: string;
}

/** The report of a batch of dives (schema `leadline/batch-report@1`, documented in report/README.md). */
export interface BatchReport {
  schema: 'leadline/batch-report@1';
  leadlineVersion: string;
  /** ISO 8601 UTC time the caller says the batch was audited (core reads no clock). */
  generatedAt: string | null;
  profile: string;
  /** The batch verdict: the worst dive verdict. */
  verdict: Verdict;
  verdictRule: string;
  verdictCounts: Record<Verdict, number>;
  fixCount: number;
  flaggedCount: number;
  dives: BatchDiveLine[];
  caution: string;
}

const RANK: Record<Verdict, number> = { pass: 0, warn: 1, fail: 2 };

/**
 * Builds the report of a batch (a season, a folder of logs) from its dive reports: one line per
 * dive in the order given, verdict counts, totals, and the worst verdict as the batch verdict.
 */
export function buildBatchReport(
  dives: readonly DiveReport[],
  options: { profile: string; generatedAtMs?: number; hrefs?: readonly (string | undefined)[] },
): BatchReport {
  const verdictCounts: Record<Verdict, number> = { pass: 0, warn: 0, fail: 0 };
  let verdict: Verdict = 'pass';
  let fixCount = 0;
  let flaggedCount = 0;
  const lines = dives.map((d, k): BatchDiveLine => {
    verdictCounts[d.verdict]++;
    if (RANK[d.verdict] > RANK[verdict]) verdict = d.verdict;
    fixCount += d.fixCount;
    flaggedCount += d.flaggedCount;
    const href = options.hrefs?.[k];
    return {
      file: d.file,
      trackId: d.trackId,
      verdict: d.verdict,
      fixCount: d.fixCount,
      flaggedCount: d.flaggedCount,
      findingCounts: d.findingCounts,
      startTime: d.summary.startTime,
      durationS: d.summary.durationS,
      ...(href === undefined ? {} : { href }),
    };
  });
  return {
    schema: 'leadline/batch-report@1',
    leadlineVersion: LEADLINE_VERSION,
    generatedAt: options.generatedAtMs === undefined ? null : new Date(options.generatedAtMs).toISOString(),
    profile: options.profile,
    verdict,
    verdictRule: `each dive: ${VERDICT_RULE}; the batch: the worst dive verdict`,
    verdictCounts,
    fixCount,
    flaggedCount,
    dives: lines,
    caution: SAFETY_CAUTION,
  };
}
