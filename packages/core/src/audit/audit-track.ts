import type { Track } from '../model/track.js';
import { createAuditContext } from './audit-context.js';
import { type AuditProfile, PRESET_PROFILES } from './audit-profile.js';
import type { AuditSetup } from './audit-setup.js';
import { checkAboveSurface } from './checks/check-above-surface.js';
import { checkDepthJumps } from './checks/check-depth-jumps.js';
import { checkDepthSign } from './checks/check-depth-sign.js';
import { checkFixRate } from './checks/check-fix-rate.js';
import { checkImpliedAcceleration } from './checks/check-implied-acceleration.js';
import { checkImpliedSpeed } from './checks/check-implied-speed.js';
import { checkImpossiblePositions } from './checks/check-impossible-positions.js';
import { checkPositionJumps } from './checks/check-position-jumps.js';
import { checkRangeFromSurface } from './checks/check-range-from-surface.js';
import { checkRepeatedTimes } from './checks/check-repeated-times.js';
import { checkSurfaceDrift } from './checks/check-surface-drift.js';
import { checkTimeBackwards } from './checks/check-time-backwards.js';
import { checkTimeGaps } from './checks/check-time-gaps.js';
import { checkTransceiverDraft } from './checks/check-transceiver-draft.js';
import { decideVerdict } from './decide-verdict.js';
import {
  estimateUncertainty,
  type FixUncertainty,
  type S44Share,
  shareMeetingS44Orders,
} from './estimate-uncertainty.js';
import type { Finding, Verdict } from './finding.js';

/** What `auditTrack` is told besides the track. */
export interface AuditOptions {
  /** The platform's thresholds; default the inspection-class ROV preset. */
  profile?: AuditProfile;
  setup?: AuditSetup;
}

/** The outcome of auditing one track (one dive). */
export interface AuditResult {
  profile: string;
  verdict: Verdict;
  /** Findings ordered by start time, then check name. */
  findings: Finding[];
  /** Per-fix bit set of the checks that flagged the fix as suspect (0 = clean); bits in `FLAG_BITS`. */
  flags: Uint16Array;
  flaggedCount: number;
  uncertainty: FixUncertainty;
  /** Share of unflagged fixes meeting each IHO S-44 order. */
  s44: S44Share[];
}

/** The checks in the order they run (each one module in `audit/checks/`). */
const CHECKS = [
  checkImpossiblePositions,
  checkTimeBackwards,
  checkRepeatedTimes,
  checkTimeGaps,
  checkFixRate,
  checkPositionJumps,
  checkImpliedSpeed,
  checkImpliedAcceleration,
  checkDepthJumps,
  checkRangeFromSurface,
  checkSurfaceDrift,
  checkTransceiverDraft,
  checkDepthSign,
  checkAboveSurface,
] as const;

/**
 * Runs every check on one track with the profile's thresholds and returns the findings, the
 * per-fix flags, the dive's verdict (worst severity: any `fail` fails, else any `warn` warns, else
 * pass), the per-fix 95 % uncertainties and the share of fixes meeting each IHO S-44 order. An
 * empty track gives one `low-fix-rate` warning. Never throws for bad data.
 */
export function auditTrack(track: Track, options: AuditOptions = {}): AuditResult {
  const profile = options.profile ?? PRESET_PROFILES['inspection-rov'];
  const context = createAuditContext(track, profile, options.setup ?? {});
  const findings: Finding[] = [];
  for (const check of CHECKS) for (const finding of check(context)) findings.push(finding);
  findings.sort(
    (a, b) =>
      a.startTimeMs - b.startTimeMs ||
      a.startIndex - b.startIndex ||
      (a.check < b.check ? -1 : a.check > b.check ? 1 : 0),
  );
  let flaggedCount = 0;
  for (let i = 0; i < context.n; i++) if (context.flags[i] !== 0) flaggedCount++;
  const uncertainty = estimateUncertainty(context);
  return {
    profile: profile.name,
    verdict: decideVerdict(findings),
    findings,
    flags: context.flags,
    flaggedCount,
    uncertainty,
    s44: shareMeetingS44Orders(uncertainty, track.columns.depthM, context.flags),
  };
}
