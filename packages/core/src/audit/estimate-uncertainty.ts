import type { AuditContext } from './audit-context.js';
import type { UncertaintyModel } from './audit-profile.js';
import { estimateHorizontalOffsets, estimateSlantRanges } from './estimate-slant-ranges.js';
import { S44_ORDERS, type S44Order, type S44OrderLimits } from './s44-orders.js';

/** Per-fix 95 % uncertainties, metres; `NaN` where they cannot be estimated. */
export interface FixUncertainty {
  horizontal95M: Float64Array;
  vertical95M: Float64Array;
}

/** The uncertainty model in force: the profile's, overridden key by key by the setup's. */
export function effectiveUncertaintyModel(context: AuditContext): UncertaintyModel {
  return { ...context.profile.uncertainty, ...context.setup.uncertainty };
}

/**
 * Per-fix horizontal uncertainty at 95 %, combining three independent error sources by root sum
 * of squares (all already at 95 %):
 * - the USBL's stated accuracy: `usblFloorM + usblRangeFraction × slant range`;
 * - the surface unit's GNSS horizontal accuracy `gnssHorizontal95M`;
 * - the heading error swinging the vehicle sideways: horizontal offset × sin(`heading95Deg`).
 * Slant range is the logged one, else from the surface position and depth; without either the
 * value is `NaN`. Vertical uncertainty at 95 % is `depthFloorM + depthFraction × depth` (`NaN`
 * without a depth).
 */
export function estimateUncertainty(context: AuditContext): FixUncertainty {
  const { n } = context;
  const model = effectiveUncertaintyModel(context);
  const ranges = estimateSlantRanges(context);
  const offsets = estimateHorizontalOffsets(context, ranges);
  const depth = context.track.columns.depthM;
  const sinHeading = Math.sin((model.heading95Deg * Math.PI) / 180);
  const horizontal95M = new Float64Array(n);
  const vertical95M = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const usbl = model.usblFloorM + model.usblRangeFraction * (ranges[i] as number);
    const heading = (offsets[i] as number) * sinHeading;
    horizontal95M[i] = Math.sqrt(usbl * usbl + model.gnssHorizontal95M * model.gnssHorizontal95M + heading * heading);
    const d = depth[i] as number;
    vertical95M[i] = model.depthFloorM + model.depthFraction * Math.abs(d);
  }
  return { horizontal95M, vertical95M };
}

/** How many fixes meet one S-44 order. */
export interface S44Share {
  order: S44Order;
  /** Fixes whose uncertainties could be judged (horizontal known; vertical too when the fix has a depth). */
  judged: number;
  /** Fixes meeting both THU_max and (when the fix has a depth) TVU_max at the fix's depth. */
  meeting: number;
  /** meeting / judged, `NaN` when nothing could be judged. */
  share: number;
}

/**
 * The share of fixes meeting each IHO S-44 Ed. 6.0.0 order: a fix meets an order when its
 * horizontal uncertainty is within THU_max(d) and its vertical uncertainty within TVU_max(d), d
 * being the fix's depth (the standard's d is the depth of what is positioned; a fix without a
 * depth is judged on THU alone at d = 0). Fixes flagged by a check (`flags` non-zero) are left out.
 */
export function shareMeetingS44Orders(
  uncertainty: FixUncertainty,
  depthM: Float64Array,
  flags?: Uint16Array,
): S44Share[] {
  const n = depthM.length;
  const orders = S44_ORDERS.length;
  const meeting = new Array<number>(orders).fill(0);
  let judged = 0;
  for (let i = 0; i < n; i++) {
    if (flags !== undefined && flags[i] !== 0) continue;
    const thu = uncertainty.horizontal95M[i] as number;
    if (Number.isNaN(thu)) continue;
    judged++;
    const d = depthM[i] as number;
    const depth = Math.max(d, 0); // NaN and negative depths judge at the surface
    const tvu = uncertainty.vertical95M[i] as number;
    for (let k = 0; k < orders; k++) {
      const o = S44_ORDERS[k] as S44OrderLimits;
      // the formulas of maximumThuM / maximumTvuM, inlined for long logs
      if (thu > o.thuConstantM + o.thuDepthFraction * depth) continue;
      const bd = o.tvuB * depth;
      if (Number.isNaN(d) || tvu * tvu <= o.tvuAM * o.tvuAM + bd * bd) meeting[k] = (meeting[k] as number) + 1;
    }
  }
  return S44_ORDERS.map(({ order }, k) => ({
    order,
    judged,
    meeting: meeting[k] as number,
    share: judged === 0 ? Number.NaN : (meeting[k] as number) / judged,
  }));
}
