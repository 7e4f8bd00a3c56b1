/** A "nice" step (1, 2 or 5 × 10^k) at least `roughStep`. */
export function niceStep(roughStep: number): number {
  if (!(roughStep > 0) || !Number.isFinite(roughStep)) return 1;
  const power = 10 ** Math.floor(Math.log10(roughStep));
  const fraction = roughStep / power;
  const nice = fraction <= 1 ? 1 : fraction <= 2 ? 2 : fraction <= 5 ? 5 : 10;
  return nice * power;
}

/** Tick values at multiples of `step` within [min, max]. */
export function ticksWithin(min: number, max: number, step: number): number[] {
  if (!(step > 0) || !Number.isFinite(min) || !Number.isFinite(max) || max < min) return [];
  const first = Math.ceil(min / step) * step;
  const out: number[] = [];
  for (let value = first, i = 0; value <= max + step * 1e-9 && i < 1000; i++, value = first + i * step) {
    // Strip the float noise of repeated addition (0.30000000000000004).
    out.push(Number(value.toPrecision(12)));
  }
  return out;
}

/** Nice ticks for about `count` divisions of [min, max]. */
export function niceTicks(min: number, max: number, count: number): { step: number; ticks: number[] } {
  const step = niceStep((max - min) / Math.max(1, count));
  return { step, ticks: ticksWithin(min, max, step) };
}
