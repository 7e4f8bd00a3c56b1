import type { BatchReport } from './build-batch-report.js';
import type { DiveReport } from './build-dive-report.js';

function cell(text: string): string {
  return text.replace(/\|/g, '\\|').replace(/\r?\n/g, ' ');
}

function num(value: number | null, decimals = 1): string {
  return value === null ? '–' : String(Number(value.toFixed(decimals)));
}

function percent(share: number | null): string {
  return share === null ? '–' : `${(share * 100).toFixed(1)} %`;
}

const VERDICT_WORD = { pass: 'PASS', warn: 'WARN', fail: 'FAIL' } as const;

/** Renders one dive's report as Markdown: verdict, summary, findings table, S-44 shares and the safety caution. */
export function formatDiveReportMarkdown(report: DiveReport): string {
  const s = report.summary;
  const lines: string[] = [];
  lines.push(`# Dive audit: ${cell(report.trackId)}`, '');
  lines.push(`**Verdict: ${VERDICT_WORD[report.verdict]}** (profile \`${report.profile}\`; ${report.verdictRule})`, '');
  lines.push(`> ${report.caution}`, '');
  lines.push('## Summary', '', '| | |', '| --- | --- |');
  lines.push(`| Log | ${cell(report.file)} |`);
  lines.push(`| Start – end (UTC) | ${s.startTime ?? '–'} – ${s.endTime ?? '–'} |`);
  lines.push(`| Duration | ${num(s.durationS === null ? null : s.durationS / 60)} min |`);
  lines.push(`| Fixes | ${report.fixCount} (${report.flaggedCount} flagged, ${percent(report.flaggedShare)}) |`);
  lines.push(`| Fix rate | ${num(s.meanFixRateHz, 2)} fixes/s |`);
  lines.push(`| Distance | ${num(s.distanceM)} m horizontal, ${num(s.distance3dM)} m 3-D |`);
  lines.push(`| Depth | max ${num(s.maxDepthM)} m, mean ${num(s.meanDepthM)} m |`);
  lines.push(`| Time on bottom | ${num(s.timeOnBottomS === null ? null : s.timeOnBottomS / 60)} min |`);
  lines.push(
    `| Max range from surface unit | ${num(s.maxSlantRangeM)} m slant, ${num(s.maxHorizontalRangeM)} m horizontal |`,
  );
  const u = report.horizontalUncertainty95M;
  lines.push(
    `| Horizontal uncertainty (95 %) | median ${num(u.median, 2)} m, 95th percentile ${num(u.p95, 2)} m, max ${num(u.max, 2)} m |`,
  );
  lines.push('');
  lines.push('## Findings', '');
  if (report.findings.length === 0) lines.push('No findings.', '');
  else {
    lines.push('| Severity | Check | From (UTC) | To (UTC) | Fixes | Measured | Limit | What it means |');
    lines.push('| --- | --- | --- | --- | --- | --- | --- | --- |');
    for (const f of report.findings)
      lines.push(
        `| ${f.severity} | ${f.check} | ${f.startTime ?? '–'} | ${f.endTime ?? '–'} | ${f.startIndex}–${f.endIndex} | ${num(f.measured, 3)} ${f.measured === null ? '' : f.unit} | ${num(f.limit, 3)} ${f.limit === null ? '' : f.unit} | ${cell(f.message)} |`,
      );
    lines.push('');
  }
  lines.push('## IHO S-44 orders (Edition 6.0.0, 95 %)', '');
  lines.push('| Order | Fixes meeting THU and TVU | Share |', '| --- | --- | --- |');
  for (const o of report.s44) lines.push(`| ${o.order} | ${o.meeting} of ${o.judged} | ${percent(o.share)} |`);
  lines.push('');
  lines.push(`_Leadline ${report.leadlineVersion}, report schema ${report.schema}._`, '');
  return lines.join('\n');
}

/** Renders a batch report as Markdown: verdict counts, one table line per dive, and the safety caution. */
export function formatBatchReportMarkdown(report: BatchReport): string {
  const lines: string[] = [];
  lines.push('# Batch audit', '');
  lines.push(
    `**Verdict: ${VERDICT_WORD[report.verdict]}** — ${report.verdictCounts.pass} pass, ${report.verdictCounts.warn} warn, ${report.verdictCounts.fail} fail (profile \`${report.profile}\`)`,
    '',
  );
  lines.push(`> ${report.caution}`, '');
  lines.push(`${report.dives.length} dives, ${report.fixCount} fixes, ${report.flaggedCount} flagged.`, '');
  lines.push('| Verdict | Dive | Log | Start (UTC) | Minutes | Fixes | Flagged | fail / warn / info |');
  lines.push('| --- | --- | --- | --- | --- | --- | --- | --- |');
  for (const d of report.dives) {
    const name = d.href === undefined ? cell(d.trackId) : `[${cell(d.trackId)}](${d.href})`;
    lines.push(
      `| ${d.verdict} | ${name} | ${cell(d.file)} | ${d.startTime ?? '–'} | ${num(d.durationS === null ? null : d.durationS / 60)} | ${d.fixCount} | ${d.flaggedCount} | ${d.findingCounts.fail} / ${d.findingCounts.warn} / ${d.findingCounts.info} |`,
    );
  }
  lines.push('', `_${report.verdictRule}. Leadline ${report.leadlineVersion}, report schema ${report.schema}._`, '');
  return lines.join('\n');
}
