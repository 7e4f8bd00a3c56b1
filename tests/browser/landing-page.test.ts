import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser } from '../support/browser.js';
import { createTestDatabase } from '../support/test-database.js';
import { startWebServer } from '../support/web-server.js';

describe('landing page in headless Chromium', () => {
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

  it('names the product and its job, shows the safety caution and the server state', async () => {
    const page = await browser.context.newPage();
    await page.goto(`${web.baseUrl}/`);
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe('Leadline');
    const text = await page.locator('main').textContent();
    expect(text).toMatch(/USBL position logs/);
    expect(text).toMatch(/not a navigation aid/i);
    await expect.poll(() => page.getByText(/^Server: /).textContent()).toMatch(/Server: up · Leadline \d+\.\d+\.\d+/);
    await page.close();
  });

  it('renders in the shipped Fira Sans and asks no outside host for anything', async () => {
    const page = await browser.context.newPage();
    const requested: string[] = [];
    page.on('request', (request) => requested.push(request.url()));
    await page.goto(`${web.baseUrl}/`);
    await page.getByRole('heading', { level: 1 }).waitFor();
    await page.evaluate(() => document.fonts.ready);

    const family = await page.getByRole('heading', { level: 1 }).evaluate((el) => getComputedStyle(el).fontFamily);
    expect(family.split(',')[0]?.replaceAll('"', '').trim()).toBe('Fira Sans');
    const loadedFaces = await page.evaluate(() =>
      [...document.fonts].filter((face) => face.status === 'loaded').map((face) => face.family.replaceAll('"', '')),
    );
    expect(loadedFaces).toContain('Fira Sans');
    // Every font file came from the app itself.
    const fontRequests = requested.filter((url) => /\.(woff2?|ttf|otf)(\?|$)/.test(url));
    expect(fontRequests.length).toBeGreaterThan(0);

    const outside = requested.filter((url) => !url.startsWith(web.baseUrl) && !url.startsWith('data:'));
    expect(outside).toEqual([]);
    await page.close();
  });
});
