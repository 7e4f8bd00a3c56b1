import type { AuditContext } from '../audit-context.js';
import type { Finding } from '../finding.js';
import { formatValue } from '../findings-from-runs.js';

/**
 * Transceiver draft outside its range: the setup's draft is compared with `profile.draftMinM` to
 * `profile.draftMaxM` (common practice: about 1-1.5 m below the surface, clear of hull and
 * objects). Shallower is a `warn` (aeration and surface noise), deeper an `info` (check it is clear
 * of the hull). Silent when the setup gives no draft; spans the whole log.
 */
export function checkTransceiverDraft(context: AuditContext): Finding[] {
  const { n, profile } = context;
  const draft = context.setup.transceiverDraftM;
  const time = context.track.columns.timeMs;
  if (draft === undefined || n === 0) return [];
  const base = {
    check: 'draft-out-of-range' as const,
    startIndex: 0,
    endIndex: n - 1,
    startTimeMs: time[0] as number,
    endTimeMs: time[n - 1] as number,
    measured: draft,
    unit: 'm',
  };
  if (draft < profile.draftMinM)
    return [
      {
        ...base,
        severity: 'warn',
        limit: profile.draftMinM,
        message: `The transceiver was only ${formatValue(draft, 2)} m below the surface (at least ${formatValue(profile.draftMinM, 2)} m is usual); surface noise and aeration degrade the fixes.`,
      },
    ];
  if (draft > profile.draftMaxM)
    return [
      {
        ...base,
        severity: 'info',
        limit: profile.draftMaxM,
        message: `The transceiver was ${formatValue(draft, 2)} m below the surface, deeper than the usual ${formatValue(profile.draftMaxM, 2)} m; check it was clear of the hull and other objects.`,
      },
    ];
  return [];
}
