import { XMLValidator } from 'fast-xml-parser';
import { describe, expect, it } from 'vitest';
import { auditTrack } from '../audit/audit-track.js';
import { buildTestTrack, type LocalFix, squarePatrol } from '../audit/test-track.js';
import { buildBatchReport } from './build-batch-report.js';
import { buildDiveReport } from './build-dive-report.js';
import { buildReportPlot } from './build-report-plot.js';
import { formatBatchReportHtml, formatDiveReportHtml } from './format-report-html.js';
import { formatReportJson } from './format-report-json.js';
import { formatBatchReportMarkdown, formatDiveReportMarkdown } from './format-report-markdown.js';
import { renderDepthSvg, renderPlanSvg } from './render-report-svg.js';
import { BatchReportSchema, DiveReportSchema } from './report-schemas.js';
import { SAFETY_CAUTION } from './safety-caution.js';

function sampleDive() {
  const fixes = squarePatrol(400, 0.3);
  (fixes[120] as LocalFix).eastM += 30;
  (fixes[121] as LocalFix).eastM += 28;
  const track = buildTestTrack(fixes, { withSurface: true });
  const audit = auditTrack(track);
  return { track, audit, report: buildDiveReport({ file: 'hollowtide/2026-06-03_0800_vehicle.csv', track, audit }) };
}

describe('buildDiveReport', () => {
  it('carries verdict, findings with ISO times, summary, S-44 shares and the caution, schema-valid', () => {
    const { report } = sampleDive();
    expect(DiveReportSchema.safeParse(report).error).toBeUndefined();
    expect(report.verdict).toBe('warn');
    expect(report.findings[0]?.check).toBe('position-jump');
    expect(report.findings[0]?.startTime).toBe('2026-06-03T08:02:00.000Z');
    expect(report.flaggedCount).toBe(2);
    expect(report.summary.fixCount).toBe(400);
    expect(report.summary.flaggedFixCount).toBe(2);
    expect(report.s44).toHaveLength(5);
    expect(report.caution).toBe(SAFETY_CAUTION);
  });
});

describe('formatReportJson', () => {
  it('sorts keys, writes non-finite numbers as null and ends with a newline', () => {
    expect(formatReportJson({ b: 1, a: { d: Number.NaN, c: [2, 1] } })).toBe(
      '{\n  "a": {\n    "c": [\n      2,\n      1\n    ],\n    "d": null\n  },\n  "b": 1\n}\n',
    );
  });
});

describe('formatDiveReportMarkdown', () => {
  it('has the verdict, the caution, a findings row per finding and the S-44 table', () => {
    const { report } = sampleDive();
    const md = formatDiveReportMarkdown(report);
    expect(md).toContain('**Verdict: WARN**');
    expect(md).toContain(`> ${SAFETY_CAUTION}`);
    expect(md.split('\n').filter((l) => l.startsWith('| warn | position-jump |'))).toHaveLength(1);
    expect(md).toContain('| exclusive |');
  });
});

describe('renderPlanSvg', () => {
  it('is well-formed SVG with one ring per flagged fix, a scale bar and a north arrow', () => {
    const { track, audit } = sampleDive();
    const svg = renderPlanSvg(buildReportPlot(track, audit.flags));
    expect(XMLValidator.validate(svg)).toBe(true);
    expect(svg.match(/stroke="#c0392b"/g)).toHaveLength(2);
    expect(svg).toMatch(/<text[^>]*>\d+ m<\/text>/);
    expect(svg).toContain('>N</text>');
  });
});

describe('renderDepthSvg', () => {
  it('is well-formed SVG with depth labels in metres', () => {
    const { track, audit } = sampleDive();
    const svg = renderDepthSvg(buildReportPlot(track, audit.flags));
    expect(XMLValidator.validate(svg)).toBe(true);
    expect(svg).toMatch(/>\d+(\.\d+)? m<\/text>/);
  });
});

describe('buildReportPlot', () => {
  it('thins long tracks but keeps every flagged fix', () => {
    const { track, audit } = sampleDive();
    const plot = buildReportPlot(track, audit.flags, 50);
    expect(plot.plan.eastM.length).toBeLessThanOrEqual(50);
    expect(plot.plan.flaggedEastM).toHaveLength(2);
    expect(plot.thinnedFrom).toBe(400);
  });
});

describe('formatDiveReportHtml', () => {
  it('is self-contained (no scripts, no external resources) and holds plots, findings, summary and caution', () => {
    const { track, audit, report } = sampleDive();
    const html = formatDiveReportHtml(report, buildReportPlot(track, audit.flags));
    expect(html.startsWith('<!DOCTYPE html>')).toBe(true);
    expect(html).not.toMatch(/<script|<link|src="http|href="http|@import|url\(/i);
    expect(html.match(/<svg /g)).toHaveLength(2);
    expect(html).toContain('position-jump');
    expect(html).toContain('Caution.');
    expect(html).toContain('@media print');
    expect(html).toContain('hollowtide/2026-06-03_0800_vehicle.csv');
  });

  it('escapes text from the log', () => {
    const { track, audit } = sampleDive();
    const report = buildDiveReport({ file: '<b>&"x".csv', track, audit });
    const html = formatDiveReportHtml(report, buildReportPlot(track, audit.flags));
    expect(html).toContain('&lt;b&gt;&amp;&quot;x&quot;.csv');
    expect(html).not.toContain('<b>&');
  });
});

describe('buildBatchReport', () => {
  it('counts verdicts, totals fixes and takes the worst verdict, schema-valid', () => {
    const a = sampleDive().report;
    const clean = buildTestTrack(squarePatrol(200, 0.3));
    const b = buildDiveReport({ file: 'b.csv', track: clean, audit: auditTrack(clean) });
    const batch = buildBatchReport([a, b], {
      profile: 'inspection-rov',
      generatedAtMs: Date.UTC(2026, 5, 4),
      hrefs: ['a.html', undefined],
    });
    expect(BatchReportSchema.safeParse(batch).error).toBeUndefined();
    expect(batch.verdict).toBe('warn');
    expect(batch.verdictCounts).toEqual({ pass: 1, warn: 1, fail: 0 });
    expect(batch.fixCount).toBe(600);
    expect(batch.dives[0]?.href).toBe('a.html');
    expect(formatBatchReportMarkdown(batch)).toContain('[test](a.html)');
    const html = formatBatchReportHtml(batch);
    expect(html).toContain('<a href="a.html">test</a>');
    expect(html).toContain('1 pass, 1 warn, 0 fail');
    expect(html).not.toContain('<svg');
    const { track, audit } = sampleDive();
    const detailed = formatBatchReportHtml(batch, {
      dives: [a, b],
      plots: [buildReportPlot(track, audit.flags, 300), undefined],
    });
    expect(detailed.match(/<svg /g)).toHaveLength(2);
    expect(detailed).toContain('id="dive-2"');
    expect(detailed).toContain('position-jump');
    expect(detailed).not.toMatch(/<script|src="http|href="http/);
  });
});
