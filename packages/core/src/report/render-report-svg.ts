import type { ReportPlot } from './build-report-plot.js';

const W = 640;
const H = 480;
const PAD = 40;

function niceStep(span: number, targetLines: number): number {
  const raw = span / targetLines;
  const power = 10 ** Math.floor(Math.log10(raw));
  for (const m of [1, 2, 5, 10]) if (raw <= m * power) return m * power;
  return 10 * power;
}

function extent(values: readonly number[][]): [number, number] {
  let lo = Number.POSITIVE_INFINITY;
  let hi = Number.NEGATIVE_INFINITY;
  for (const list of values)
    for (const v of list) {
      if (v < lo) lo = v;
      if (v > hi) hi = v;
    }
  if (lo === Number.POSITIVE_INFINITY) return [0, 1];
  if (hi - lo < 1) return [lo - 0.5, hi + 0.5];
  return [lo, hi];
}

const f1 = (v: number) => v.toFixed(1);

/**
 * The plan view as an inline SVG: the track in metres east/north (equal scales), a metric grid, a
 * scale bar, a north arrow, the surface unit's positions (grey), flagged fixes (red rings, also
 * distinguishable in print by shape) and start/end markers.
 */
export function renderPlanSvg(plot: ReportPlot): string {
  const { plan } = plot;
  const [e0, e1] = extent([plan.eastM, plan.flaggedEastM, plan.surfaceEastM]);
  const [n0, n1] = extent([plan.northM, plan.flaggedNorthM, plan.surfaceNorthM]);
  const scale = Math.min((W - 2 * PAD) / (e1 - e0), (H - 2 * PAD) / (n1 - n0));
  const cx = (e0 + e1) / 2;
  const cy = (n0 + n1) / 2;
  const x = (e: number) => W / 2 + (e - cx) * scale;
  const y = (n: number) => H / 2 - (n - cy) * scale;
  const parts: string[] = [];
  parts.push(
    `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${W} ${H}" width="100%" role="img" aria-label="Plan view of the track in metres">`,
  );
  parts.push(`<rect x="0" y="0" width="${W}" height="${H}" fill="#fbfaf7" stroke="#c9c4b8"/>`);
  const step = niceStep(Math.max((W - 2 * PAD) / scale, (H - 2 * PAD) / scale), 8);
  const left = cx - W / 2 / scale;
  const right = cx + W / 2 / scale;
  const bottom = cy - H / 2 / scale;
  const top = cy + H / 2 / scale;
  const grid: string[] = [];
  for (let g = Math.ceil(left / step) * step; g <= right; g += step) grid.push(`M${f1(x(g))} 0V${H}`);
  for (let g = Math.ceil(bottom / step) * step; g <= top; g += step) grid.push(`M0 ${f1(y(g))}H${W}`);
  parts.push(`<path d="${grid.join('')}" stroke="#e4dfd3" stroke-width="1" fill="none"/>`);
  if (plan.surfaceEastM.length > 0) {
    const pts = plan.surfaceEastM.map((e, i) => `${f1(x(e))},${f1(y(plan.surfaceNorthM[i] as number))}`).join(' ');
    parts.push(`<polyline points="${pts}" fill="none" stroke="#8a8a8a" stroke-width="1" stroke-dasharray="3 2"/>`);
    const sx = x(plan.surfaceEastM[0] as number);
    const sy = y(plan.surfaceNorthM[0] as number);
    parts.push(`<path d="M${f1(sx)} ${f1(sy - 7)}l6 11h-12z" fill="#8a8a8a"><title>surface unit</title></path>`);
  }
  if (plan.eastM.length > 0) {
    const pts = plan.eastM.map((e, i) => `${f1(x(e))},${f1(y(plan.northM[i] as number))}`).join(' ');
    parts.push(`<polyline points="${pts}" fill="none" stroke="#1f5f8b" stroke-width="1.5" stroke-linejoin="round"/>`);
    const first = `${f1(x(plan.eastM[0] as number))},${f1(y(plan.northM[0] as number))}`;
    const lastIndex = plan.eastM.length - 1;
    parts.push(
      `<circle cx="${first.split(',')[0]}" cy="${first.split(',')[1]}" r="5" fill="#2e8b57"><title>start</title></circle>`,
    );
    parts.push(
      `<rect x="${f1(x(plan.eastM[lastIndex] as number) - 4)}" y="${f1(y(plan.northM[lastIndex] as number) - 4)}" width="8" height="8" fill="#333"><title>end</title></rect>`,
    );
  }
  for (let i = 0; i < plan.flaggedEastM.length; i++)
    parts.push(
      `<circle cx="${f1(x(plan.flaggedEastM[i] as number))}" cy="${f1(y(plan.flaggedNorthM[i] as number))}" r="3.5" fill="none" stroke="#c0392b" stroke-width="1.5"/>`,
    );
  // scale bar: a round length about a fifth of the width
  const barM = niceStep((W / scale) * 0.2, 1);
  const barPx = barM * scale;
  parts.push(
    `<g font-family="sans-serif" font-size="12" fill="#333"><path d="M${PAD} ${H - 16}h${f1(barPx)}M${PAD} ${H - 20}v8M${f1(PAD + barPx)} ${H - 20}v8" stroke="#333" stroke-width="2"/><text x="${f1(PAD + barPx + 6)}" y="${H - 12}">${barM} m</text>`,
  );
  parts.push(
    `<path d="M${W - 30} 44l8 -24l8 24l-8 -6z" fill="#333"/><text x="${W - 26}" y="58">N</text><text x="${PAD}" y="20">grid ${step} m</text></g>`,
  );
  parts.push('</svg>');
  return parts.join('');
}

/** The depth profile as an inline SVG: depth (down) against minutes since the first fix, flagged fixes as red rings. */
export function renderDepthSvg(plot: ReportPlot): string {
  const { profile } = plot;
  const [t0, t1] = extent([profile.timeS, profile.flaggedTimeS]);
  const [d0raw, d1raw] = extent([profile.depthM, profile.flaggedDepthM]);
  const d0 = Math.min(0, d0raw);
  const d1 = d1raw + Math.max(0.5, (d1raw - d0) * 0.05); // room below the deepest fix
  const h = 240;
  const x = (t: number) => PAD + ((t - t0) / (t1 - t0)) * (W - 2 * PAD);
  const y = (d: number) => 20 + ((d - d0) / (d1 - d0)) * (h - 50);
  const parts: string[] = [];
  parts.push(
    `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${W} ${h}" width="100%" role="img" aria-label="Depth over time">`,
  );
  parts.push(`<rect x="0" y="0" width="${W}" height="${h}" fill="#fbfaf7" stroke="#c9c4b8"/>`);
  const dStep = niceStep(d1 - d0, 5);
  const tStepMin = niceStep((t1 - t0) / 60, 6);
  const axis: string[] = [];
  const labels: string[] = [];
  for (let d = Math.ceil(d0 / dStep) * dStep; d <= d1; d += dStep) {
    axis.push(`M${PAD} ${f1(y(d))}H${W - PAD}`);
    labels.push(`<text x="4" y="${f1(y(d) + 4)}">${Number(d.toFixed(2))} m</text>`);
  }
  for (let m = Math.ceil(t0 / 60 / tStepMin) * tStepMin; m * 60 <= t1; m += tStepMin) {
    axis.push(`M${f1(x(m * 60))} 20V${h - 30}`);
    labels.push(`<text x="${f1(x(m * 60) - 8)}" y="${h - 12}">${Number(m.toFixed(1))} min</text>`);
  }
  parts.push(`<path d="${axis.join('')}" stroke="#e4dfd3" fill="none"/>`);
  parts.push(`<g font-family="sans-serif" font-size="11" fill="#333">${labels.join('')}</g>`);
  if (profile.timeS.length > 0) {
    const pts = profile.timeS.map((t, i) => `${f1(x(t))},${f1(y(profile.depthM[i] as number))}`).join(' ');
    parts.push(`<polyline points="${pts}" fill="none" stroke="#1f5f8b" stroke-width="1.5"/>`);
  }
  for (let i = 0; i < profile.flaggedTimeS.length; i++)
    parts.push(
      `<circle cx="${f1(x(profile.flaggedTimeS[i] as number))}" cy="${f1(y(profile.flaggedDepthM[i] as number))}" r="3" fill="none" stroke="#c0392b" stroke-width="1.5"/>`,
    );
  parts.push('</svg>');
  return parts.join('');
}
