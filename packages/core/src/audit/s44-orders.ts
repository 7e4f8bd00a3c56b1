/**
 * IHO S-44 Edition 6.0.0 (2020), Table 1: the survey orders and their maximum allowable
 * uncertainties, all at the 95 % confidence level.
 * - THU_max(d) = constant + percentage × d (metres; d = depth in metres).
 * - TVU_max(d) = √(a² + (b × d)²) (chapter 3, "Maximum Allowable Vertical Uncertainty").
 */

/** The S-44 survey orders, strictest first. */
export type S44Order = 'exclusive' | 'special' | '1a' | '1b' | '2';

/** One order's published parameters (S-44 Ed. 6.0.0 Table 1). */
export interface S44OrderLimits {
  order: S44Order;
  /** Name as the standard prints it. */
  label: string;
  thuConstantM: number;
  /** THU depth-dependent part as a fraction of depth (0.05 = 5 % of depth). */
  thuDepthFraction: number;
  tvuAM: number;
  tvuB: number;
}

/** S-44 Ed. 6.0.0 Table 1, strictest first. */
export const S44_ORDERS: readonly S44OrderLimits[] = [
  { order: 'exclusive', label: 'Exclusive', thuConstantM: 1, thuDepthFraction: 0, tvuAM: 0.15, tvuB: 0.0075 },
  { order: 'special', label: 'Special', thuConstantM: 2, thuDepthFraction: 0, tvuAM: 0.25, tvuB: 0.0075 },
  { order: '1a', label: '1a', thuConstantM: 5, thuDepthFraction: 0.05, tvuAM: 0.5, tvuB: 0.013 },
  { order: '1b', label: '1b', thuConstantM: 5, thuDepthFraction: 0.05, tvuAM: 0.5, tvuB: 0.013 },
  { order: '2', label: '2', thuConstantM: 20, thuDepthFraction: 0.1, tvuAM: 1, tvuB: 0.023 },
];

function limitsOf(order: S44Order): S44OrderLimits {
  const limits = S44_ORDERS.find((o) => o.order === order);
  if (limits === undefined) throw new RangeError(`unknown S-44 order ${order}`);
  return limits;
}

/** Maximum allowable horizontal uncertainty (95 %) of an S-44 order at a depth in metres: constant + fraction × depth. */
export function maximumThuM(order: S44Order, depthM: number): number {
  const limits = limitsOf(order);
  return limits.thuConstantM + limits.thuDepthFraction * Math.max(0, depthM);
}

/** Maximum allowable vertical uncertainty (95 %) of an S-44 order at a depth in metres: √(a² + (b·d)²). */
export function maximumTvuM(order: S44Order, depthM: number): number {
  const limits = limitsOf(order);
  const bd = limits.tvuB * Math.max(0, depthM);
  return Math.sqrt(limits.tvuAM * limits.tvuAM + bd * bd);
}
