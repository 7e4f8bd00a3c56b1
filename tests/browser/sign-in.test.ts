import { DEMO_PASSWORD, DEMO_USERS, loadDemoData } from '@leadline/server';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser } from '../support/browser.js';
import { createTestDatabase } from '../support/test-database.js';
import { startWebServer } from '../support/web-server.js';

describe('sign-in, the signed-in layout and the 404 page in headless Chromium', () => {
  let database: Awaited<ReturnType<typeof createTestDatabase>>;
  let web: Awaited<ReturnType<typeof startWebServer>>;
  let browser: Awaited<ReturnType<typeof launchBrowser>>;
  const admin = DEMO_USERS[0];

  beforeAll(async () => {
    database = await createTestDatabase();
    // The invented demo organisation and people, with the shortest season the loader takes.
    await loadDemoData(database.db, { seed: 3, dives: 1, diveMinutes: 5 });
    web = await startWebServer(database);
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
    await web?.close();
    await database?.drop();
  });

  it('sends a signed-out visitor to sign in, checks the form, signs in, comes back, and signs out', async () => {
    const page = await browser.context.newPage();
    await page.goto(`${web.baseUrl}/dives/no-such-dive`);
    await page.waitForURL(/\/sign-in\?next=%2Fdives%2Fno-such-dive$/);
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe('Sign in');

    // Nothing typed: each field says what is missing, by keyboard alone.
    await page.getByLabel('E-mail address').focus();
    await page.keyboard.press('Tab');
    await page.keyboard.press('Tab');
    await page.keyboard.press('Enter');
    await expect.poll(() => page.getByText('Enter your e-mail address.').count()).toBe(1);
    expect(await page.getByLabel('Password').getAttribute('aria-invalid')).toBe('true');

    // A wrong password: the server's refusal shows in the form.
    await page.getByLabel('E-mail address').fill(admin.email);
    await page.getByLabel('Password').fill('not-the-password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await expect
      .poll(() => page.getByRole('alert').filter({ hasText: /wrong/ }).textContent())
      .toBe('The e-mail address or the password is wrong.');

    // The right one: back to the page asked for, with the person named in the header.
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(/\/dives\/no-such-dive$/);
    await expect.poll(() => page.getByRole('banner').textContent()).toContain(admin.displayName);
    // No such dive: an error state with a way to try again, not a blank page.
    await expect.poll(() => page.getByRole('alert').textContent()).toMatch(/The dive could not be loaded/);
    expect(await page.getByRole('button', { name: 'Try again' }).count()).toBe(1);

    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(/\/sign-in(\?next=[^&]*)?$/);
    await expect.poll(() => page.getByRole('banner').getByRole('link', { name: 'Sign in' }).count()).toBe(1);
    await page.close();
  });

  it('shows the 404 page for an unknown address, with a way back', async () => {
    const page = await browser.context.newPage();
    await page.goto(`${web.baseUrl}/no/such/page`);
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe('Nothing here');
    await page.getByRole('link', { name: 'Back to the start' }).click();
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe('Leadline');
    await page.close();
  });
});
