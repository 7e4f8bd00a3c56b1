import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser } from '../support/browser.js';
import { canvasPixels, openWatchedPage } from '../support/browser-pages.js';
import { createTestDatabase } from '../support/test-database.js';
import { startWebServer } from '../support/web-server.js';

const SCREENSHOTS = fileURLToPath(new URL('../../.test-artifacts/screenshots', import.meta.url));

describe('dive page (preview) in headless Chromium', () => {
  let database: Awaited<ReturnType<typeof createTestDatabase>>;
  let web: Awaited<ReturnType<typeof startWebServer>>;
  let browser: Awaited<ReturnType<typeof launchBrowser>>;

  beforeAll(async () => {
    database = await createTestDatabase();
    web = await startWebServer(database);
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
    await web?.close();
    await database?.drop();
  });

  it('draws a 50 000-fix dive, highlights a chosen finding on both plots, zooms with the wheel', async () => {
    const { page, requested, pageErrors } = await openWatchedPage(browser.context);

    await page.goto(`${web.baseUrl}/preview/dive?fixes=50000&seed=1`);
    const plan = page.getByTestId('plan-canvas');
    await expect.poll(() => plan.getAttribute('data-drawn-vertices'), { timeout: 45_000 }).not.toBe('0');
    // From navigation start to the first drawing of the 50 000-fix track (reported, not asserted).
    const readyMs = await page.evaluate(() => performance.now());

    // The page says it is a preview.
    expect(await page.getByRole('note', { name: 'Preview' }).textContent()).toMatch(/simulated in your browser/);
    expect(await page.getByRole('heading', { level: 1 }).textContent()).toMatch(/Preview dive/);
    expect(await page.getByRole('complementary', { name: 'Safety' }).textContent()).toMatch(/not a navigation aid/i);

    // The track is drawn: many vertices survive decimation and a good share of the canvas is inked.
    const drawn = Number(await plan.getAttribute('data-drawn-vertices'));
    expect(drawn).toBeGreaterThan(1000);
    // Decimated and capped at 5 × (width + height) plus flagged fixes.
    expect(drawn).toBeLessThan(12_000);
    const before = await canvasPixels(page, 'plan-canvas');
    expect(before.inked / before.total).toBeGreaterThan(0.01);
    expect(before.highlight).toBe(0);
    const profileBefore = await canvasPixels(page, 'profile-canvas');
    expect(profileBefore.inked / profileBefore.total).toBeGreaterThan(0.01);
    expect(profileBefore.highlight).toBe(0);

    // Choose a finding: it is pressed, and its span turns up in sand on both plots.
    const finding = page.getByRole('button', { name: /position-jump/ }).first();
    await finding.click();
    expect(await finding.getAttribute('aria-pressed')).toBe('true');
    await expect.poll(async () => (await canvasPixels(page, 'plan-canvas')).highlight).toBeGreaterThan(40);
    await expect.poll(async () => (await canvasPixels(page, 'profile-canvas')).highlight).toBeGreaterThan(40);
    expect(await plan.getAttribute('data-highlight')).toMatch(/^\d+-\d+$/);
    const scrubberText = await page.getByRole('slider', { name: 'Time along the dive' }).getAttribute('aria-valuetext');
    expect(scrubberText).toMatch(/UTC, depth .* m, fix [\d,]+ of 4\d,\d{3}/);

    // Wheel over the plot zooms in: fewer metres per pixel, and a shorter scale bar length.
    const scaleBefore = Number(await plan.getAttribute('data-metres-per-px'));
    const barBefore = await page.getByTestId('scale-bar').textContent();
    const box = await plan.boundingBox();
    if (box === null) throw new Error('the plan canvas has no box');
    await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
    const drawsBefore = Number(await plan.getAttribute('data-draw-count'));
    const wheelStart = await page.evaluate(() => performance.now());
    await page.mouse.wheel(0, -600);
    await expect
      .poll(async () => Number(await plan.getAttribute('data-metres-per-px')))
      .toBeLessThan(scaleBefore / 1.5);
    await expect.poll(async () => Number(await plan.getAttribute('data-draw-count'))).toBeGreaterThan(drawsBefore);
    // Until the browser has painted the new drawing (two animation frames later).
    await page.evaluate(() => new Promise((resolve) => requestAnimationFrame(() => requestAnimationFrame(resolve))));
    const wheelMs = (await page.evaluate(() => performance.now())) - wheelStart;
    expect(await page.getByTestId('scale-bar').textContent()).not.toBe(barBefore);

    // Fit to dive brings the whole dive back.
    await page.getByRole('button', { name: 'Fit to dive' }).click();
    await expect.poll(async () => Number(await plan.getAttribute('data-metres-per-px'))).toBeCloseTo(scaleBefore, 6);

    // A projected grid can be chosen (core's reprojection in the browser).
    await page.getByLabel('Grid').selectOption({ index: 1 });
    await expect.poll(() => page.getByText(/Grid: EPSG:32[67]\d\d WGS 84 \/ UTM zone \d+[NS]\./).count()).toBe(1);

    // Keep the highlighted finding chosen for the picture.
    mkdirSync(SCREENSHOTS, { recursive: true });
    await page.screenshot({ path: join(SCREENSHOTS, 'dive-page.png'), fullPage: true });

    const marks = await page.evaluate(() =>
      Object.fromEntries(performance.getEntriesByType('mark').map((mark) => [mark.name, mark.startTime])),
    );
    const since = (from: string, to: string) => ((marks[to] ?? Number.NaN) - (marks[from] ?? Number.NaN)).toFixed(0);
    console.log(
      `dive page, 50 000 fixes: first drawing ${readyMs.toFixed(0)} ms after navigation start ` +
        `(simulating the dive in the browser ${since('leadline:preview-simulate-start', 'leadline:preview-simulate-end')} ms, ` +
        `data in hand to track drawn ${since('leadline:prepare-start', 'leadline:plan-first-draw')} ms); ` +
        `wheel zoom redrawn within ${wheelMs.toFixed(0)} ms; ${drawn} vertices stroked after decimation`,
    );
    expect(pageErrors).toEqual([]);
    expect(requested.filter((url) => !url.startsWith(web.baseUrl) && !url.startsWith('data:'))).toEqual([]);
    await page.close();
  });
});
