import { execFileSync } from 'node:child_process';
import { copyFileSync, mkdirSync, mkdtempSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { gzipSync } from 'node:zlib';
import { planSeason, simulatePlannedDive } from '@leadline/core';
import { DEMO_PASSWORD, DEMO_USERS, loadDemoData } from '@leadline/server';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser } from '../support/browser.js';
import { canvasPixels, openWatchedPage, signInThroughPage } from '../support/browser-pages.js';
import { createTestDatabase } from '../support/test-database.js';
import { startWebServer } from '../support/web-server.js';

const ARTIFACTS = fileURLToPath(new URL('../../.test-artifacts/screenshots', import.meta.url));
const DOCS_SCREENSHOTS = fileURLToPath(new URL('../../docs/screenshots', import.meta.url));
const GPX_XSD = fileURLToPath(new URL('../../packages/core/src/read/schemas/gpx-1.1.xsd', import.meta.url));

/** Saves a picture for the test run and, for the README, a copy under docs/screenshots. */
async function savePicture(page: Page, name: string): Promise<void> {
  mkdirSync(ARTIFACTS, { recursive: true });
  mkdirSync(DOCS_SCREENSHOTS, { recursive: true });
  const path = join(ARTIFACTS, `${name}.png`);
  await page.screenshot({ path });
  copyFileSync(path, join(DOCS_SCREENSHOTS, `${name}.png`));
}

/** Splits one CSV line written by our writer (no quoted commas in numeric rows). */
function cells(line: string | undefined): string[] {
  return (line ?? '').split(',');
}

describe('upload a log, follow its processing, open and download the dive in headless Chromium', () => {
  let database: Awaited<ReturnType<typeof createTestDatabase>>;
  let web: Awaited<ReturnType<typeof startWebServer>>;
  let browser: Awaited<ReturnType<typeof launchBrowser>>;
  let work: string;
  const editor = DEMO_USERS.find((u) => u.role === 'editor') ?? DEMO_USERS[1];
  const viewer = DEMO_USERS.find((u) => u.role === 'viewer') ?? DEMO_USERS[2];

  beforeAll(async () => {
    database = await createTestDatabase();
    // The invented demo organisation, its people and projects, with the shortest season the loader takes.
    await loadDemoData(database.db, { seed: 3, dives: 1, diveMinutes: 5 });
    web = await startWebServer(database, { processing: true });
    browser = await launchBrowser();
    work = mkdtempSync(join(tmpdir(), 'leadline-upload-'));
  });
  afterAll(async () => {
    await browser?.close();
    await web?.close();
    await database?.drop();
    if (work) rmSync(work, { recursive: true, force: true });
  });

  it('tells a viewer that their role cannot upload', async () => {
    const page = await browser.context.newPage();
    await signInThroughPage(page, web.baseUrl, viewer.email, DEMO_PASSWORD);
    expect(await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Upload' }).count()).toBe(0);
    await page.goto(`${web.baseUrl}/upload`);
    await expect.poll(() => page.getByRole('heading', { name: 'Your role cannot upload' }).count()).toBe(1);
    expect(await page.getByLabel('Choose log files').count()).toBe(0);
    await page.close();
  });

  it('uploads a simulated log, waits for it to be processed, opens the dive, highlights a finding, downloads GPX and CSV', async () => {
    // A simulated 20-minute dive in the simulator's plain CSV layout (core's season planner).
    const [planned] = planSeason({ seed: 41, dives: 1, diveMinutes: 20, dialect: 'csv' });
    if (planned === undefined) throw new Error('no dive planned');
    const [file] = simulatePlannedDive(planned).files;
    if (file === undefined) throw new Error('the simulator wrote no file');
    const logPath = join(work, file.name.split('/').pop() ?? 'simulated.csv');
    writeFileSync(logPath, file.text);

    const { page, pageErrors } = await openWatchedPage(browser.context);
    await signInThroughPage(page, web.baseUrl, editor.email, DEMO_PASSWORD);

    // Upload page from the navigation; the project chooser lists the organisation's projects.
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Upload' }).click();
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe('Upload logs');
    const project = page.getByLabel('Project');
    await expect.poll(() => project.locator('option').count()).toBeGreaterThan(0);
    await page.getByLabel('Choose log files').setInputFiles(logPath);

    // The file shows up with its progress, then its processing status, then its dive with a verdict.
    const uploads = page.getByRole('list', { name: 'Uploads' });
    await expect.poll(() => uploads.getByRole('listitem').count()).toBe(1);
    const diveLink = uploads.getByRole('link', { name: 'Dive 1' });
    await expect.poll(() => diveLink.count(), { timeout: 45_000 }).toBe(1);
    expect(await uploads.textContent()).toMatch(/Uploaded and archived\./);
    expect(await uploads.textContent()).toMatch(/Processed/);
    expect(await uploads.textContent()).toMatch(/(pass|warn|fail)/);
    await savePicture(page, 'upload-page');

    // The dive page draws the track.
    await diveLink.click();
    await page.waitForURL(/\/dives\/[0-9a-f-]{36}$/);
    const plan = page.getByTestId('plan-canvas');
    await expect.poll(() => plan.getAttribute('data-drawn-vertices'), { timeout: 30_000 }).not.toBe('0');
    expect(Number(await plan.getAttribute('data-drawn-vertices'))).toBeGreaterThan(100);
    const before = await canvasPixels(page, 'plan-canvas');
    expect(before.inked / before.total).toBeGreaterThan(0.01);
    expect(before.highlight).toBe(0);
    expect(await page.getByRole('complementary', { name: 'Safety' }).textContent()).toMatch(/not a navigation aid/i);

    // Choose a finding: it is pressed, and its span turns up in the highlight colour on the plan.
    const findings = page.locator('section[aria-labelledby="findings-heading"] button[aria-pressed]');
    expect(await findings.count()).toBeGreaterThan(0);
    const finding = findings.first();
    await finding.click();
    expect(await finding.getAttribute('aria-pressed')).toBe('true');
    expect(await plan.getAttribute('data-highlight')).toMatch(/^\d+-\d+$/);
    await expect.poll(async () => (await canvasPixels(page, 'plan-canvas')).highlight).toBeGreaterThan(0);

    // The processing history lists the first run as the default.
    expect(await page.getByRole('table').textContent()).toMatch(/Read and audited.*Default — shown above/s);

    await page.evaluate(() => window.scrollTo(0, 0));
    await savePicture(page, 'dive-page');

    // GPX download, valid against the GPX 1.1 XSD (TopoGrafix schema vendored in core, checked with libxml2's xmllint).
    const downloads = page.getByRole('region', { name: 'Downloads' });
    await downloads.getByLabel('Track format').selectOption('gpx');
    const [gpx] = await Promise.all([
      page.waitForEvent('download'),
      downloads.getByRole('button', { name: 'Download the track' }).click(),
    ]);
    expect(gpx.suggestedFilename()).toMatch(/-dive-01\.gpx$/);
    const gpxPath = join(work, gpx.suggestedFilename());
    await gpx.saveAs(gpxPath);
    execFileSync('/usr/bin/xmllint', ['--noout', '--schema', GPX_XSD, gpxPath], { stdio: 'pipe' });
    expect((readFileSync(gpxPath, 'utf8').match(/<trkpt /g) ?? []).length).toBeGreaterThan(100);

    // CSV in ETRS89 / UTM zone 32N: easting and northing agree with PROJ's cs2cs to 2 mm.
    await downloads.getByLabel('Track format').selectOption('csv');
    // The CRS picker searches the EPSG registry by code.
    const crsBox = downloads.getByRole('combobox', { name: 'Coordinates in (CSV)' });
    await crsBox.click();
    await crsBox.fill('25832');
    const option = downloads.getByRole('option').filter({ hasText: 'EPSG:25832' }).first();
    await expect.poll(() => option.count(), { timeout: 15_000 }).toBe(1);
    await option.click();
    await expect.poll(() => crsBox.inputValue()).toMatch(/EPSG:25832/);
    const [csv] = await Promise.all([
      page.waitForEvent('download'),
      downloads.getByRole('button', { name: 'Download the track' }).click(),
    ]);
    const csvPath = join(work, csv.suggestedFilename());
    await csv.saveAs(csvPath);
    const lines = readFileSync(csvPath, 'utf8')
      .split(/\r?\n/)
      .filter((line) => line !== '');
    const header = cells(lines[0]);
    expect(header).toEqual(expect.arrayContaining(['lat', 'lon', 'easting_m', 'northing_m']));
    const rows = [1, Math.floor(lines.length / 2), lines.length - 1].map((i) => cells(lines[i]));
    const at = (row: string[], name: string) => Number(row[header.indexOf(name)]);
    const projected = execFileSync('/usr/bin/cs2cs', ['EPSG:4326', 'EPSG:25832', '-f', '%.4f'], {
      input: rows.map((row) => `${at(row, 'lat')} ${at(row, 'lon')}\n`).join(''),
    })
      .toString()
      .trim()
      .split('\n')
      .map((line) => line.trim().split(/\s+/).map(Number));
    rows.forEach((row, k) => {
      const [eastingM, northingM] = projected[k] ?? [];
      expect(Math.abs(at(row, 'easting_m') - (eastingM ?? Number.NaN))).toBeLessThan(0.002);
      expect(Math.abs(at(row, 'northing_m') - (northingM ?? Number.NaN))).toBeLessThan(0.002);
    });

    // Reprocess with a re-solve (bearings relative to the heading, a 2° heading offset): the run is
    // followed to its end, the history gains it as the new default, and the page says how far positions moved.
    const reprocess = page.getByRole('form', { name: 'Reprocess the dive' });
    await reprocess.getByLabel(/Re-solve the positions/).check();
    await reprocess.getByLabel('Bearings measured from').selectOption('relative');
    await reprocess.getByLabel('Heading offset (°)').fill('2');
    await reprocess.getByRole('button', { name: 'Reprocess the dive' }).click();
    const moved = page.getByTestId('displacement');
    await expect.poll(() => moved.count(), { timeout: 45_000 }).toBe(1);
    const movedText = (await moved.textContent()) ?? '';
    const median = Number(/Median([\d.,]+) m/.exec(movedText)?.[1]?.replace(/,/g, ''));
    expect(median).toBeGreaterThan(0);
    await expect
      .poll(() => page.getByRole('table').textContent())
      .toMatch(/Reprocessed \(this dive\).*Default — shown above.*Read and audited/s);

    // The archive panels (history, reprocess with its displacement, downloads), for the test run's record.
    await page.getByRole('heading', { name: /Processing history/ }).scrollIntoViewIfNeeded();
    await page.screenshot({ path: join(ARTIFACTS, 'dive-page-archive.png'), fullPage: true });

    expect(pageErrors).toEqual([]);
    await page.close();
  });

  it('measures the landing page JavaScript and the 50 000-fix preview (reported, not asserted)', async () => {
    const page = await browser.context.newPage();
    await page.setViewportSize({ width: 1280, height: 900 });
    const scripts = new Map<string, number>();
    page.on('response', async (response) => {
      if (response.request().resourceType() !== 'script') return;
      try {
        scripts.set(response.url(), gzipSync(await response.body(), { level: 9 }).length);
      } catch {
        // A response without a body (redirect) carries no script.
      }
    });
    await page.goto(`${web.baseUrl}/`, { waitUntil: 'networkidle' });
    const gzippedKb = [...scripts.values()].reduce((a, b) => a + b, 0) / 1024;
    expect(scripts.size).toBeGreaterThan(0);

    // Long tasks from the start, to tell when the main thread is free after the first drawing.
    await page.addInitScript(() => {
      const w = window as unknown as { __longTasks: Array<{ start: number; end: number }> };
      w.__longTasks = [];
      new PerformanceObserver((list) => {
        for (const entry of list.getEntries())
          w.__longTasks.push({ start: entry.startTime, end: entry.startTime + entry.duration });
      }).observe({ type: 'longtask', buffered: true });
    });
    await page.goto(`${web.baseUrl}/preview/dive?fixes=50000&seed=1`);
    const plan = page.getByTestId('plan-canvas');
    await expect.poll(() => plan.getAttribute('data-drawn-vertices'), { timeout: 45_000 }).not.toBe('0');
    // Give late work a second to show up as long tasks, then take the end of the last one.
    await page.waitForTimeout(1000);
    const t = await page.evaluate(() => {
      const tasks = (window as unknown as { __longTasks: Array<{ start: number; end: number }> }).__longTasks;
      const mark = (name: string) => performance.getEntriesByName(name, 'mark')[0]?.startTime ?? Number.NaN;
      return {
        lastLongTaskEnd: tasks.reduce((m, task) => Math.max(m, task.end), 0),
        longTasks: tasks.length,
        simulated: mark('leadline:preview-simulate-end'),
        prepareStart: mark('leadline:prepare-start'),
        firstDraw: mark('leadline:plan-first-draw'),
      };
    });
    // Interactive: the track is drawn and no long task keeps the main thread busy after it.
    const interactiveMs = Math.max(t.firstDraw, t.lastLongTaskEnd);
    console.log(
      `initial JavaScript of the landing page: ${gzippedKb.toFixed(1)} KB gzipped in ${scripts.size} files; ` +
        `50 000-fix preview: dive simulated in the browser by ${t.simulated.toFixed(0)} ms, track first drawn at ` +
        `${t.firstDraw.toFixed(0)} ms, interactive (after the last of ${t.longTasks} long tasks) at ${interactiveMs.toFixed(0)} ms ` +
        `after navigation start; data in hand to interactive ${(interactiveMs - t.prepareStart).toFixed(0)} ms`,
    );
    expect(interactiveMs).toBeGreaterThan(t.prepareStart);
    await page.close();
  });

  it('keeps the README pictures small', () => {
    for (const name of ['upload-page', 'dive-page'])
      expect(statSync(join(DOCS_SCREENSHOTS, `${name}.png`)).size).toBeLessThan(260_000);
  });
});
