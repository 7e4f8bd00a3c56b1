import { execFileSync } from 'node:child_process';
import { copyFileSync, mkdirSync, mkdtempSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { planSeason, simulatePlannedDive } from '@leadline/core';
import { DEMO_PASSWORD, DEMO_USERS, loadDemoData } from '@leadline/server';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser } from '../support/browser.js';
import { signInThroughPage } from '../support/browser-pages.js';
import { createTestDatabase } from '../support/test-database.js';
import { startWebServer } from '../support/web-server.js';

const ARTIFACTS = fileURLToPath(new URL('../../.test-artifacts/screenshots', import.meta.url));
const DOCS_SCREENSHOTS = fileURLToPath(new URL('../../docs/screenshots', import.meta.url));
const DIVES = 4;

/** Saves a picture for the test run and, for the README, a copy under docs/screenshots. */
async function savePicture(page: Page, name: string): Promise<void> {
  mkdirSync(ARTIFACTS, { recursive: true });
  mkdirSync(DOCS_SCREENSHOTS, { recursive: true });
  const path = join(ARTIFACTS, `${name}.png`);
  await page.screenshot({ path });
  copyFileSync(path, join(DOCS_SCREENSHOTS, `${name}.png`));
}

/** The dive ids the table shows, top to bottom. */
function rowIds(page: Page): Promise<string[]> {
  return page
    .getByRole('table', { name: /^Dives of / })
    .locator('tbody tr')
    .evaluateAll((rows) => rows.map((row) => row.getAttribute('data-dive-id') ?? ''));
}

/** Posts log files to the upload route from inside the page, with the page's own session. */
function uploadFromPage(page: Page, url: string, files: Array<{ name: string; text: string }>) {
  return page.evaluate(
    async ({ url, files }) => {
      const form = new FormData();
      for (const file of files) form.append('files', new Blob([file.text], { type: 'text/csv' }), file.name);
      const response = await fetch(url, { method: 'POST', body: form, credentials: 'same-origin' });
      return { status: response.status, body: await response.json() };
    },
    { url, files },
  );
}

describe('project page: table, filters, selection and zip download, upload control by role, in headless Chromium', () => {
  let database: Awaited<ReturnType<typeof createTestDatabase>>;
  let web: Awaited<ReturnType<typeof startWebServer>>;
  let browser: Awaited<ReturnType<typeof launchBrowser>>;
  let work: string;
  let organisationId: string;
  let projectId: string;
  let projectName: string;
  const editor = DEMO_USERS.find((u) => u.role === 'editor') ?? DEMO_USERS[1];
  const viewer = DEMO_USERS.find((u) => u.role === 'viewer') ?? DEMO_USERS[2];

  beforeAll(async () => {
    database = await createTestDatabase();
    // The invented demo organisation, its people and projects (their one log is left unprocessed).
    await loadDemoData(database.db, { seed: 3, dives: 1, diveMinutes: 5 });
    const project = await database
      .db('projects')
      .join('organisations', 'organisations.id', 'projects.organisation_id')
      .orderBy('projects.name')
      .first<{ id: string; name: string; organisation_id: string }>(
        'projects.id',
        'projects.name',
        'projects.organisation_id',
      );
    if (project === undefined) throw new Error('the demo loaded no project');
    ({ id: projectId, name: projectName, organisation_id: organisationId } = project);
    web = await startWebServer(database, { processing: true });
    browser = await launchBrowser();
    work = mkdtempSync(join(tmpdir(), 'leadline-project-page-'));
  });
  afterAll(async () => {
    await browser?.close();
    await web?.close();
    await database?.drop();
    if (work) rmSync(work, { recursive: true, force: true });
  });

  const uploadUrl = () => `/api/v1/organisations/${organisationId}/projects/${projectId}/logs`;
  const projectDives = () =>
    database
      .db('dives')
      .join('logs', 'logs.id', 'dives.log_id')
      .where('dives.project_id', projectId)
      .select<Array<{ id: string; max_depth_m: number; verdict: string; file: string }>>(
        'dives.id',
        'dives.max_depth_m',
        'dives.verdict',
        'logs.original_file_name as file',
      );

  it('an editor uploads logs, finds them on the home page, then sorts, filters, chooses columns and downloads two dives as one zip', async () => {
    const page = await browser.context.newPage();
    await page.setViewportSize({ width: 1280, height: 900 });
    await signInThroughPage(page, web.baseUrl, editor.email, DEMO_PASSWORD);

    // Simulated dives (core's season planner) in the simulator's plain CSV layout.
    const files = planSeason({ seed: 77, dives: DIVES, diveMinutes: 6, dialect: 'csv' }).map((planned) => {
      const [file] = simulatePlannedDive(planned).files;
      if (file === undefined) throw new Error('the simulator wrote no file');
      return { name: file.name.split('/').pop() ?? 'simulated.csv', text: file.text };
    });
    const uploaded = await uploadFromPage(page, uploadUrl(), files);
    expect(uploaded.status).toBe(201);
    await expect.poll(async () => (await projectDives()).length, { timeout: 120_000, interval: 500 }).toBe(DIVES);
    const inDatabase = await projectDives();

    // Home: the recent dives of the organisation and its projects, one click from the project page.
    await page.goto(`${web.baseUrl}/`);
    const recent = page.getByRole('region', { name: 'Recent dives' });
    // Every dive of the organisation counts (the demo's own log may have been processed too), up to eight.
    const organisationDives = await database.db('dives').count<{ count: string }[]>({ count: '*' });
    const recentExpected = Math.min(8, Number(organisationDives[0]?.count ?? 0));
    expect(recentExpected).toBeGreaterThanOrEqual(DIVES);
    await expect.poll(() => recent.getByRole('link').count()).toBe(recentExpected);
    await page
      .getByRole('region', { name: 'Projects' })
      .getByRole('link', { name: new RegExp(projectName) })
      .click();
    await page.waitForURL(new RegExp(`/projects/${projectId}$`));
    await expect.poll(() => rowIds(page).then((ids) => ids.length)).toBe(DIVES);
    expect((await rowIds(page)).sort()).toEqual(inDatabase.map((d) => d.id).sort());
    expect(await page.getByText(`Showing 1–${DIVES} of`).count()).toBe(1);
    const upload = page.getByRole('link', { name: 'Upload into this project' });
    expect(await upload.getAttribute('href')).toBe(`/upload?project=${projectId}`);

    // Sort by max depth: the server's order, deepest first, then shallowest first (as the database has it).
    const deepestFirst = [...inDatabase].sort((a, b) => b.max_depth_m - a.max_depth_m).map((d) => d.id);
    await page.getByRole('button', { name: /Max depth/ }).click();
    await page.waitForURL(/sort=maxDepth|sort=-maxDepth/);
    await expect.poll(() => rowIds(page)).toEqual(deepestFirst);
    await page.getByRole('button', { name: /Max depth/ }).click();
    await expect.poll(() => rowIds(page)).toEqual([...deepestFirst].reverse());

    // Filter by depth: only the dives at least as deep as the second deepest.
    const threshold = [...inDatabase].sort((a, b) => b.max_depth_m - a.max_depth_m)[1]?.max_depth_m ?? 0;
    await page.getByLabel('Max depth at least (m)').fill(String(Math.floor(threshold * 10) / 10));
    await page.getByRole('button', { name: 'Apply filters' }).click();
    const expected = inDatabase.filter((d) => d.max_depth_m >= Math.floor(threshold * 10) / 10).map((d) => d.id);
    await expect.poll(() => rowIds(page).then((ids) => ids.sort())).toEqual(expected.sort());
    expect(expected.length).toBeLessThan(DIVES);
    await page.getByRole('button', { name: 'Clear filters' }).click();
    await expect.poll(() => rowIds(page).then((ids) => ids.length)).toBe(DIVES);

    // Filter by verdict (applied on the click): the rows are the database's dives with that verdict, or
    // the empty state when there are none.
    for (const verdict of ['fail', 'warn'] as const) {
      const label = verdict === 'fail' ? 'Fail' : 'Warn';
      await page.getByRole('checkbox', { name: label, exact: true }).check();
      await page.waitForURL(new RegExp(`verdict=${verdict}`));
      const withVerdict = inDatabase.filter((d) => d.verdict === verdict).map((d) => d.id);
      if (withVerdict.length === 0)
        await expect.poll(() => page.getByText('No dive matches these filters').count()).toBe(1);
      else await expect.poll(() => rowIds(page).then((ids) => ids.sort())).toEqual(withVerdict.sort());
      await page.getByRole('checkbox', { name: label, exact: true }).uncheck();
    }
    await expect.poll(() => rowIds(page).then((ids) => ids.length)).toBe(DIVES);

    // Column choice, remembered across a reload.
    await page.getByText(/^Columns \(/).click();
    await page.getByRole('checkbox', { name: 'Fixes' }).uncheck();
    expect(await page.getByRole('columnheader', { name: 'Fixes' }).count()).toBe(0);
    await page.reload();
    await expect.poll(() => rowIds(page).then((ids) => ids.length)).toBe(DIVES);
    expect(await page.getByRole('columnheader', { name: 'Fixes' }).count()).toBe(0);
    expect(await page.getByRole('columnheader', { name: 'Max depth' }).count()).toBe(1);

    // Select two dives; CSV in UTM (zone from the data) through the CRS picker.
    const [firstId, secondId] = await rowIds(page);
    const chosen = inDatabase.filter((d) => d.id === firstId || d.id === secondId);
    for (const id of [firstId, secondId]) await page.locator(`tr[data-dive-id="${id}"] input[type=checkbox]`).check();
    await page.getByLabel('Format').selectOption('csv');
    const picker = page.getByRole('combobox', { name: 'Coordinate system (CSV)' });
    await picker.click();
    await page.getByRole('option', { name: /UTM, zone from the data/ }).click();
    expect(await picker.inputValue()).toBe('UTM, zone from the data (utm)');
    await page.mouse.move(0, 0);
    await savePicture(page, 'project-table');

    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('link', { name: 'Download selected (2)' }).click(),
    ]);
    const zipPath = join(work, 'selected.zip');
    await download.saveAs(zipPath);
    // unzip (Info-ZIP) reads the archive: an outside check that it is whole.
    const entries = execFileSync('unzip', ['-Z1', zipPath]).toString().trim().split('\n').sort();
    expect(entries).toHaveLength(3);
    expect(entries).toContain('crs-notes.txt');
    for (const dive of chosen) {
      const stem = dive.file.replace(/\.[^.]+$/, '').replace(/[\\/:*?"<>|\s]+/g, '_');
      expect(entries.some((e) => e.startsWith(stem) && e.endsWith('.csv'))).toBe(true);
    }
    const notes = execFileSync('unzip', ['-p', zipPath, 'crs-notes.txt']).toString();
    expect(notes).toMatch(/UTM zone \d+/i);
    expect(statSync(join(DOCS_SCREENSHOTS, 'project-table.png')).size).toBeLessThan(250_000);
    await page.close();
  });

  it('a viewer sees the table but no upload control, and a direct upload with their session is refused', async () => {
    await browser.context.clearCookies();
    const page = await browser.context.newPage();
    // A tablet on deck, upright: the page fits its width (the table scrolls inside its own box if it must).
    await page.setViewportSize({ width: 768, height: 1024 });
    await signInThroughPage(page, web.baseUrl, viewer.email, DEMO_PASSWORD);
    await page.goto(`${web.baseUrl}/projects/${projectId}`);
    await expect.poll(() => rowIds(page).then((ids) => ids.length)).toBe(DIVES);
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(768);
    expect(await page.getByRole('link', { name: 'Upload into this project' }).count()).toBe(0);
    expect(await page.locator(`a[href^="/upload"]`).count()).toBe(0);

    const logsBefore = await database
      .db('logs')
      .where({ project_id: projectId })
      .count<{ count: string }[]>({ count: '*' });
    const [planned] = planSeason({ seed: 78, dives: 1, diveMinutes: 5, dialect: 'csv' });
    const file = planned === undefined ? undefined : simulatePlannedDive(planned).files[0];
    if (file === undefined) throw new Error('the simulator wrote no file');
    const refused = await uploadFromPage(page, uploadUrl(), [{ name: 'viewer-attempt.csv', text: file.text }]);
    expect(refused.status).toBe(403);
    expect(refused.body.error.code).toBe('forbidden');
    expect(refused.body.error.message).toMatch(/editor/);
    const logsAfter = await database
      .db('logs')
      .where({ project_id: projectId })
      .count<{ count: string }[]>({ count: '*' });
    expect(logsAfter).toEqual(logsBefore);
    await page.close();
  });
});
