import type { BatchReport } from './build-batch-report.js';
import type { DiveReport } from './build-dive-report.js';
import type { ReportPlot } from './build-report-plot.js';
import { renderDepthSvg, renderPlanSvg } from './render-report-svg.js';

function esc(text: string): string {
  return text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}

function num(value: number | null, decimals = 1): string {
  return value === null ? '–' : String(Number(value.toFixed(decimals)));
}

function percent(share: number | null): string {
  return share === null ? '–' : `${(share * 100).toFixed(1)} %`;
}

const STYLE = `
body{font-family:system-ui,-apple-system,"Segoe UI",sans-serif;color:#222;max-width:60rem;margin:1.5rem auto;padding:0 1rem;line-height:1.4}
h1{font-size:1.5rem;margin:.2rem 0}h2{font-size:1.15rem;margin-top:1.6rem;border-bottom:1px solid #ddd}
table{border-collapse:collapse;width:100%;font-size:.9rem}th,td{border:1px solid #ddd;padding:.25rem .4rem;text-align:left;vertical-align:top}
th{background:#f3f1ec}.verdict{display:inline-block;padding:.2rem .7rem;border-radius:.3rem;font-weight:700;border:2px solid}
.pass{color:#1e6b3a;border-color:#1e6b3a}.warn{color:#8a5a00;border-color:#8a5a00}.fail{color:#a12a1d;border-color:#a12a1d}
.sev-fail{font-weight:700;color:#a12a1d}.sev-warn{color:#8a5a00}.sev-info{color:#555}
.caution{border-left:4px solid #a12a1d;background:#fdf3f1;padding:.5rem .8rem;margin:1rem 0}
.plots{display:grid;gap:1rem}figure{margin:0}figcaption{font-size:.85rem;color:#555}
footer{margin-top:2rem;font-size:.8rem;color:#666}
.pair{display:grid;grid-template-columns:1fr 1fr;gap:.5rem}section{break-inside:avoid}
@media print{body{max-width:none;margin:0}h2{break-after:avoid}figure,table{break-inside:avoid}a{color:inherit;text-decoration:none}}
`;

function page(title: string, body: string): string {
  return `<!DOCTYPE html>\n<html lang="en">\n<head>\n<meta charset="utf-8">\n<meta name="viewport" content="width=device-width, initial-scale=1">\n<title>${esc(title)}</title>\n<style>${STYLE}</style>\n</head>\n<body>\n${body}\n</body>\n</html>\n`;
}

/**
 * One dive's report as a self-contained HTML page (no scripts, fonts or links to fetch; readable
 * offline and printable): verdict, safety caution, summary, plan view and depth profile as inline
 * SVG with flagged fixes marked, findings table and S-44 shares.
 */
export function formatDiveReportHtml(report: DiveReport, plot: ReportPlot): string {
  const s = report.summary;
  const u = report.horizontalUncertainty95M;
  const rows = (pairs: Array<[string, string]>) =>
    pairs.map(([k, v]) => `<tr><th scope="row">${esc(k)}</th><td>${esc(v)}</td></tr>`).join('\n');
  const summary = rows([
    ['Log', report.file],
    ['Start – end (UTC)', `${s.startTime ?? '–'} – ${s.endTime ?? '–'}`],
    ['Duration', `${num(s.durationS === null ? null : s.durationS / 60)} min`],
    ['Fixes', `${report.fixCount} (${report.flaggedCount} flagged, ${percent(report.flaggedShare)})`],
    ['Fix rate', `${num(s.meanFixRateHz, 2)} fixes/s`],
    ['Distance', `${num(s.distanceM)} m horizontal, ${num(s.distance3dM)} m 3-D`],
    ['Depth', `max ${num(s.maxDepthM)} m, mean ${num(s.meanDepthM)} m`],
    ['Time on bottom', `${num(s.timeOnBottomS === null ? null : s.timeOnBottomS / 60)} min`],
    ['Max range from surface unit', `${num(s.maxSlantRangeM)} m slant, ${num(s.maxHorizontalRangeM)} m horizontal`],
    [
      'Horizontal uncertainty (95 %)',
      `median ${num(u.median, 2)} m, 95th percentile ${num(u.p95, 2)} m, max ${num(u.max, 2)} m`,
    ],
    ['Profile', report.profile],
  ]);
  const findings =
    report.findings.length === 0
      ? '<p>No findings.</p>'
      : `<table><thead><tr><th>Severity</th><th>Check</th><th>From (UTC)</th><th>To (UTC)</th><th>Fixes</th><th>Measured</th><th>Limit</th><th>What it means</th></tr></thead><tbody>\n${report.findings
          .map(
            (f) =>
              `<tr><td class="sev-${f.severity}">${f.severity}</td><td>${esc(f.check)}</td><td>${esc(f.startTime ?? '–')}</td><td>${esc(f.endTime ?? '–')}</td><td>${f.startIndex}–${f.endIndex}</td><td>${esc(`${num(f.measured, 3)} ${f.measured === null ? '' : f.unit}`)}</td><td>${esc(`${num(f.limit, 3)} ${f.limit === null ? '' : f.unit}`)}</td><td>${esc(f.message)}</td></tr>`,
          )
          .join('\n')}</tbody></table>`;
  const s44 = `<table><thead><tr><th>Order</th><th>Fixes meeting THU and TVU</th><th>Share</th></tr></thead><tbody>${report.s44
    .map((o) => `<tr><td>${esc(o.order)}</td><td>${o.meeting} of ${o.judged}</td><td>${percent(o.share)}</td></tr>`)
    .join('')}</tbody></table>`;
  const thinned =
    plot.thinnedFrom > plot.plan.eastM.length + plot.plan.flaggedEastM.length
      ? ` Drawn from a thinned track (every flagged fix kept) of ${plot.thinnedFrom} fixes.`
      : '';
  const body = `<header><h1>Dive audit: ${esc(report.trackId)}</h1>
<p><span class="verdict ${report.verdict}">${report.verdict.toUpperCase()}</span> ${report.findingCounts.fail} fail, ${report.findingCounts.warn} warn, ${report.findingCounts.info} info findings</p></header>
<p class="caution"><strong>Caution.</strong> ${esc(report.caution)}</p>
<h2>Summary</h2>
<table><tbody>
${summary}
</tbody></table>
<h2>Track</h2>
<div class="plots">
<figure>${renderPlanSvg(plot)}<figcaption>Plan view in metres east and north of the first fix: vehicle track (blue), surface unit (grey triangle and dashed line), flagged fixes (red rings), start (green dot), end (black square).${thinned}</figcaption></figure>
<figure>${renderDepthSvg(plot)}<figcaption>Depth against time since the first fix; flagged fixes as red rings.</figcaption></figure>
</div>
<h2>Findings</h2>
${findings}
<h2>IHO S-44 orders (Edition 6.0.0, 95 %)</h2>
${s44}
<footer>Verdict rule: ${esc(report.verdictRule)}. Leadline ${esc(report.leadlineVersion)}, report schema ${esc(report.schema)}.</footer>`;
  return page(`Dive audit ${report.trackId}: ${report.verdict}`, body);
}

/** What a batch page may show besides its table: each dive's report and a small plot, by the batch's dive order. */
export interface BatchHtmlDetail {
  dives?: readonly DiveReport[];
  plots?: readonly (ReportPlot | undefined)[];
}

/**
 * A batch report as a self-contained HTML page: verdict counts, one row per dive (linked to its
 * own report when `href` is set), and, when `detail` gives them, every dive's warn and fail
 * findings and a small plan view and depth profile per dive, flagged fixes marked.
 */
export function formatBatchReportHtml(report: BatchReport, detail: BatchHtmlDetail = {}): string {
  const rows = report.dives
    .map((d, k) => {
      const name = d.href === undefined ? esc(d.trackId) : `<a href="${esc(d.href)}">${esc(d.trackId)}</a>`;
      return `<tr><td class="sev-${d.verdict === 'pass' ? 'info' : d.verdict}">${d.verdict}</td><td><a href="#dive-${k + 1}">${k + 1}</a></td><td>${name}</td><td>${esc(d.file)}</td><td>${esc(d.startTime ?? '–')}</td><td>${num(d.durationS === null ? null : d.durationS / 60)}</td><td>${d.fixCount}</td><td>${d.flaggedCount}</td><td>${d.findingCounts.fail} / ${d.findingCounts.warn} / ${d.findingCounts.info}</td></tr>`;
    })
    .join('\n');
  const sections: string[] = [];
  const dives = detail.dives ?? [];
  dives.forEach((dive, k) => {
    const plot = detail.plots?.[k];
    const serious = dive.findings.filter((f) => f.severity !== 'info');
    const findings =
      serious.length === 0
        ? '<p>No warn or fail findings.</p>'
        : `<table><thead><tr><th>Severity</th><th>Check</th><th>From (UTC)</th><th>To (UTC)</th><th>What it means</th></tr></thead><tbody>${serious
            .slice(0, 200)
            .map(
              (f) =>
                `<tr><td class="sev-${f.severity}">${f.severity}</td><td>${esc(f.check)}</td><td>${esc(f.startTime ?? '–')}</td><td>${esc(f.endTime ?? '–')}</td><td>${esc(f.message)}</td></tr>`,
            )
            .join(
              '',
            )}</tbody></table>${serious.length > 200 ? `<p>… and ${serious.length - 200} more in the dive's own report.</p>` : ''}`;
    const plots =
      plot === undefined
        ? ''
        : `<div class="pair"><figure>${renderPlanSvg(plot)}</figure><figure>${renderDepthSvg(plot)}</figure></div>`;
    sections.push(
      `<section id="dive-${k + 1}"><h2>${k + 1}. ${esc(dive.trackId)} <span class="verdict ${dive.verdict}">${dive.verdict.toUpperCase()}</span></h2><p>${esc(dive.summary.startTime ?? '–')}, ${num(dive.summary.durationS === null ? null : dive.summary.durationS / 60)} min, ${dive.fixCount} fixes (${dive.flaggedCount} flagged), max depth ${num(dive.summary.maxDepthM)} m.</p>${plots}${findings}</section>`,
    );
  });
  const body = `<header><h1>Batch audit</h1>
<p><span class="verdict ${report.verdict}">${report.verdict.toUpperCase()}</span> ${report.verdictCounts.pass} pass, ${report.verdictCounts.warn} warn, ${report.verdictCounts.fail} fail; ${report.dives.length} dives, ${report.fixCount} fixes, ${report.flaggedCount} flagged (profile ${esc(report.profile)})</p></header>
<p class="caution"><strong>Caution.</strong> ${esc(report.caution)}</p>
<table><thead><tr><th>Verdict</th><th>#</th><th>Dive</th><th>Log</th><th>Start (UTC)</th><th>Minutes</th><th>Fixes</th><th>Flagged</th><th>fail / warn / info</th></tr></thead><tbody>
${rows}
</tbody></table>
${sections.join('\n')}
<footer>${esc(report.verdictRule)}. Leadline ${esc(report.leadlineVersion)}, report schema ${esc(report.schema)}${report.generatedAt === null ? '' : `, audited ${esc(report.generatedAt)}`}. Plan views in metres east and north of each dive's first fix; flagged fixes as red rings.</footer>`;
  return page(`Batch audit: ${report.verdict}`, body);
}
