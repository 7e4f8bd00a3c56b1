import type { ColourMode } from '../types';

// Our own ramps. Every stop keeps at least 3:1 contrast with the white plot background (WCAG 1.4.11).
const RAMPS: Readonly<Record<ColourMode, readonly string[]>> = {
  // shallow teal to deep indigo: darker is deeper
  depth: ['#23806f', '#1f6e8c', '#2a5599', '#35388a', '#1c1f4f'],
  // early rust through plum to late blue
  time: ['#b0461c', '#9a3663', '#6f3d92', '#3b4fa6', '#1d5d78'],
};

/** How many colour classes the track is split into. */
export const COLOUR_CLASSES = 10;

function parseHex(hex: string): [number, number, number] {
  const value = Number.parseInt(hex.slice(1), 16);
  return [(value >> 16) & 255, (value >> 8) & 255, value & 255];
}

function toHex([r, g, b]: [number, number, number]): string {
  return `#${[r, g, b].map((c) => Math.round(c).toString(16).padStart(2, '0')).join('')}`;
}

/** The colour at `t` ∈ [0, 1] along a mode's ramp (clamped). */
export function rampColour(mode: ColourMode, t: number): string {
  const stops = RAMPS[mode];
  const clamped = Number.isFinite(t) ? Math.min(1, Math.max(0, t)) : 0;
  const position = clamped * (stops.length - 1);
  const index = Math.min(stops.length - 2, Math.floor(position));
  const a = parseHex(stops[index] as string);
  const b = parseHex(stops[index + 1] as string);
  const f = position - index;
  return toHex([a[0] + (b[0] - a[0]) * f, a[1] + (b[1] - a[1]) * f, a[2] + (b[2] - a[2]) * f]);
}

/** The colours of the track's classes, first (shallow/early) to last. */
export function classColours(mode: ColourMode): string[] {
  return Array.from({ length: COLOUR_CLASSES }, (_, i) => rampColour(mode, i / (COLOUR_CLASSES - 1)));
}

/** The class of a value within [min, max]; 0 for a missing value or an empty range. */
export function colourClass(value: number, min: number, max: number): number {
  if (!Number.isFinite(value) || !(max > min)) return 0;
  const t = (value - min) / (max - min);
  return Math.min(COLOUR_CLASSES - 1, Math.max(0, Math.floor(t * COLOUR_CLASSES)));
}

/** Colours of things drawn over the track. */
export const PLOT_COLOURS = {
  background: '#ffffff',
  grid: '#dbe4e8',
  gridLabel: '#3d5565',
  surface: '#7a5212',
  highlightHalo: '#f2c879',
  highlightLine: '#0b2a3c',
  cursor: '#0b2a3c',
  info: '#1f5fa8',
  warn: '#9a5800',
  fail: '#b3261e',
} as const;
