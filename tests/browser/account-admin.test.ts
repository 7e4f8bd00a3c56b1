import { mkdirSync } from 'node:fs';
import { gzipSync } from 'node:zlib';
import { DEMO_ORGANISATION, DEMO_PASSWORD, DEMO_USERS, loadDemoData } from '@leadline/server';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser } from '../support/browser.js';
import { createTestDatabase } from '../support/test-database.js';
import { startWebServer } from '../support/web-server.js';

const SCREENSHOTS = '.test-artifacts/screenshots';

describe('API tokens, members, invitations and password reset in headless Chromium', () => {
  let database: Awaited<ReturnType<typeof createTestDatabase>>;
  let web: Awaited<ReturnType<typeof startWebServer>>;
  let browser: Awaited<ReturnType<typeof launchBrowser>>;
  const admin = DEMO_USERS[0];

  beforeAll(async () => {
    database = await createTestDatabase();
    await loadDemoData(database.db, { seed: 3, dives: 1, diveMinutes: 5 });
    web = await startWebServer(database);
    browser = await launchBrowser();
    mkdirSync(SCREENSHOTS, { recursive: true });
  });
  afterAll(async () => {
    await browser?.close();
    await web?.close();
    await database?.drop();
  });

  async function newPage(): Promise<Page> {
    const page = await browser.context.newPage();
    await page.setViewportSize({ width: 1280, height: 900 });
    return page;
  }

  async function signIn(page: Page, email: string, password: string): Promise<void> {
    await page.goto(`${web.baseUrl}/sign-in`);
    await page.getByLabel('E-mail address').fill(email);
    await page.getByLabel('Password').fill(password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(`${web.baseUrl}/`);
  }

  async function signOut(page: Page): Promise<void> {
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(/\/sign-in/);
  }

  /** The development mailbox through its API, as the admin (a session outside the browser). */
  async function mailTo(address: string): Promise<{ subject: string; text: string }[]> {
    const session = await fetch(`${web.baseUrl}/api/v1/session`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify({ email: admin.email, password: DEMO_PASSWORD }),
    });
    expect(session.status).toBe(200);
    const cookie = (session.headers.get('set-cookie') ?? '').split(';')[0] ?? '';
    const answer = await fetch(`${web.baseUrl}/api/v1/dev/mailbox?to=${encodeURIComponent(address)}`, {
      headers: { cookie },
    });
    expect(answer.status).toBe(200);
    return ((await answer.json()) as { messages: { subject: string; text: string }[] }).messages;
  }

  function linkIn(text: string, path: string): string {
    const found = text.match(new RegExp(`${web.baseUrl}${path}\\?token=[^\\s]+`));
    expect(found, `a ${path} link pointing at this server in:\n${text}`).not.toBeNull();
    return found?.[0] ?? '';
  }

  it('measures the JavaScript a first visit to the landing page loads (gzipped)', async () => {
    // Runs first, on a fresh profile, so nothing comes from the cache.
    const page = await newPage();
    const scripts = new Map<string, Promise<Buffer>>();
    page.on('response', (response) => {
      if (response.request().resourceType() === 'script' && response.ok()) scripts.set(response.url(), response.body());
    });
    await page.goto(`${web.baseUrl}/`, { waitUntil: 'networkidle' });
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe('Leadline');
    let raw = 0;
    let gzipped = 0;
    const rows: string[] = [];
    for (const [url, body] of scripts) {
      const bytes = await body;
      const packed = gzipSync(bytes, { level: 9 }).length;
      raw += bytes.length;
      gzipped += packed;
      rows.push(
        `  ${new URL(url).pathname}: ${(bytes.length / 1024).toFixed(1)} KiB, ${(packed / 1024).toFixed(1)} KiB gzipped`,
      );
    }
    console.log(
      `Landing page, first visit: ${scripts.size} JavaScript files, ${(raw / 1024).toFixed(1)} KiB, ` +
        `${(gzipped / 1024).toFixed(1)} KiB gzipped (zlib level 9)\n${rows.join('\n')}`,
    );
    expect(scripts.size).toBeGreaterThan(0);
    expect(gzipped).toBeGreaterThan(0);
    await page.close();
  });

  it('creates a token, shows it once with a curl example, the API takes it, and refuses it once revoked', async () => {
    const page = await newPage();
    await signIn(page, admin.email, DEMO_PASSWORD);
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'API tokens' }).click();
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe('API tokens');
    await expect.poll(() => page.getByText('No tokens yet').count()).toBe(1);

    // Keyboard only: the name, then the scope and expiry keep their defaults (read, 90 days).
    await page.getByRole('textbox', { name: /^Name/ }).focus();
    await page.keyboard.type('Browser test pipeline');
    await page.keyboard.press('Enter');
    const secretField = page.getByRole('textbox', { name: 'Token' });
    await secretField.waitFor();
    const token = await secretField.inputValue();
    expect(token).toMatch(/^llt_/);
    const curl = (await page.locator('pre').textContent()) ?? '';
    expect(curl).toContain(`Authorization: Bearer ${token}`);
    const projectsUrl = curl.match(/(http:\/\/\S+\/projects)$/)?.[1] ?? '';
    expect(projectsUrl.startsWith(`${web.baseUrl}/api/v1/organisations/`)).toBe(true);
    await page.screenshot({ path: `${SCREENSHOTS}/tokens-created.png` });

    const withToken = await fetch(projectsUrl, { headers: { Authorization: `Bearer ${token}` } });
    expect(withToken.status).toBe(200);
    expect(((await withToken.json()) as { projects: unknown[] }).projects.length).toBeGreaterThan(0);

    // Gone once dismissed: the list has the token by name and prefix only, now with its last use.
    await page.getByRole('button', { name: 'I have copied it' }).click();
    expect(await page.getByRole('textbox', { name: 'Token' }).count()).toBe(0);
    await page.reload();
    const row = page.getByRole('row', { name: /Browser test pipeline/ });
    await expect.poll(() => row.textContent()).toMatch(/read.*UTC.*UTC.*active/);
    expect(await row.textContent()).not.toContain(token);
    expect(await row.getByRole('cell').nth(2).textContent()).not.toBe('never');

    await row.getByRole('button', { name: 'Revoke Browser test pipeline' }).click();
    await row.getByRole('button', { name: 'Yes, revoke Browser test pipeline' }).click();
    await expect.poll(() => row.textContent()).toMatch(/revoked/);
    const afterRevoke = await fetch(projectsUrl, { headers: { Authorization: `Bearer ${token}` } });
    expect(afterRevoke.status).toBe(401);
    await page.close();
  });

  it('an admin invites a new member, the mail arrives in the mailbox, and the invitee joins with that role', async () => {
    const invitee = {
      email: 'wren.castellan@hollowtide.example',
      name: 'Wren Castellan',
      password: 'kelp forest at slack tide',
    };
    const page = await newPage();
    await signIn(page, admin.email, DEMO_PASSWORD);
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Members' }).click();
    await expect
      .poll(() => page.getByRole('heading', { level: 1 }).textContent())
      .toBe(`Members of ${DEMO_ORGANISATION.name}`);
    await expect.poll(() => page.getByRole('row', { name: new RegExp(admin.displayName) }).count()).toBe(1);

    await page.getByLabel('E-mail address').fill(invitee.email);
    await page.getByLabel('Role', { exact: true }).selectOption('editor');
    await page.getByRole('button', { name: 'Send the invitation' }).click();
    await expect.poll(() => page.getByText(`Invitation sent to ${invitee.email}.`).count()).toBe(1);
    await expect
      .poll(() => page.getByRole('listitem').filter({ hasText: invitee.email }).textContent())
      .toMatch(/editor/);
    await page.screenshot({ path: `${SCREENSHOTS}/members.png`, fullPage: true });

    // The development mailbox page shows the message with its link clickable.
    await page.getByRole('link', { name: 'development mailbox' }).click();
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe('Development mailbox');
    const message = page.getByRole('article', { name: `You are invited to ${DEMO_ORGANISATION.name} on Leadline` });
    await expect.poll(() => message.textContent()).toContain(`to ${invitee.email}`);
    const link = message.getByRole('link', { name: /\/accept-invitation\?token=/ });
    const href = (await link.getAttribute('href')) ?? '';
    expect(href.startsWith(`${web.baseUrl}/accept-invitation?token=`)).toBe(true);

    await signOut(page);
    await page.goto(href);
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe('Join your team on Leadline');
    await page.getByLabel('Your name').fill(invitee.name);
    await page.getByLabel('Password', { exact: true }).fill(invitee.password);
    await page.getByLabel('Password again').fill(invitee.password);
    await page.getByRole('button', { name: 'Create the account and join' }).click();
    await page.waitForURL(`${web.baseUrl}/`);
    const banner = page.getByRole('banner');
    await expect.poll(() => banner.textContent()).toContain(invitee.name);
    expect(await banner.textContent()).toContain(`${DEMO_ORGANISATION.name} · editor`);
    // An editor gets no Members entry, and the members page refuses plainly.
    expect(await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Members' }).count()).toBe(0);
    const me = await page.evaluate(async () => (await fetch('/api/v1/me')).json());
    expect(me).toMatchObject({ user: { email: invitee.email }, memberships: [{ role: 'editor' }] });
    await page.goto(`${web.baseUrl}/members`);
    await expect.poll(() => page.getByRole('alert').textContent()).toMatch(/Members are managed by admins/);

    // The link worked once.
    await signOut(page);
    await page.goto(href);
    await page.getByLabel('Your name').fill('Someone Else');
    await page.getByLabel('Password', { exact: true }).fill(invitee.password);
    await page.getByLabel('Password again').fill(invitee.password);
    await page.getByRole('button', { name: 'Create the account and join' }).click();
    await expect.poll(() => page.getByRole('alert').textContent()).toMatch(/already used or expired/);
    await page.close();
  });

  it('switches between organisations in the header, and the admin pages fit a tablet', async () => {
    const person = DEMO_USERS[4];
    const page = await newPage();
    await signIn(page, person.email, DEMO_PASSWORD);
    const nav = page.getByRole('navigation', { name: 'Main' });
    // One organisation: no chooser, just its name and the role there.
    expect(await page.getByRole('banner').textContent()).toContain(`${DEMO_ORGANISATION.name} · editor`);
    expect(await page.getByRole('banner').getByLabel('Organisation').count()).toBe(0);

    const created = await page.evaluate(async () => {
      const response = await fetch('/api/v1/organisations', {
        method: 'POST',
        headers: { 'Content-Type': 'application/json' },
        body: JSON.stringify({ name: 'Saltmarsh Survey Trials', slug: 'saltmarsh-trials' }),
      });
      return response.status;
    });
    expect(created).toBe(201);
    await page.reload();
    const chooser = page.getByRole('banner').getByLabel('Organisation', { exact: true });
    await chooser.waitFor();
    await chooser.selectOption({ label: `${DEMO_ORGANISATION.name} (editor)` });
    await expect.poll(() => nav.getByRole('link', { name: 'Members' }).count()).toBe(0);
    await chooser.selectOption({ label: 'Saltmarsh Survey Trials (admin)' });
    await nav.getByRole('link', { name: 'Members' }).click();
    await expect
      .poll(() => page.getByRole('heading', { level: 1 }).textContent())
      .toBe('Members of Saltmarsh Survey Trials');
    // The choice is remembered across a reload.
    await page.reload();
    await expect
      .poll(() => page.getByRole('heading', { level: 1 }).textContent())
      .toBe('Members of Saltmarsh Survey Trials');

    // Down to a tablet held upright: no page-wide sideways scrolling (wide tables scroll inside their box).
    await page.setViewportSize({ width: 768, height: 1024 });
    for (const path of ['/members', '/tokens', '/dev/mailbox']) {
      await page.goto(`${web.baseUrl}${path}`);
      await page.getByRole('heading', { level: 1 }).waitFor();
      await page.waitForLoadState('networkidle');
      const widths = await page.evaluate(() => ({
        scroll: document.documentElement.scrollWidth,
        client: document.documentElement.clientWidth,
      }));
      expect(widths.scroll, `${path} at 768 px`).toBeLessThanOrEqual(widths.client);
      await page.screenshot({ path: `${SCREENSHOTS}/tablet${path.replaceAll('/', '-')}.png`, fullPage: true });
    }
    await page.close();
  });

  it('resets a forgotten password through the mailed link, then signs in with the new one', async () => {
    const person = DEMO_USERS[1];
    const newPassword = 'slack water at the quay';
    const page = await newPage();
    await page.goto(`${web.baseUrl}/sign-in`);
    await page.getByRole('link', { name: 'Forgot password?' }).click();
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe('Forgot your password?');
    await page.getByLabel('E-mail address').fill(person.email);
    await page.getByRole('button', { name: 'Send me a reset link' }).click();
    await expect.poll(() => page.getByText('Check your mail').count()).toBe(1);

    const messages = await mailTo(person.email);
    const reset = messages.find((m) => m.subject === 'Reset your Leadline password');
    expect(reset).toBeDefined();
    const href = linkIn(reset?.text ?? '', '/reset-password');

    await page.goto(href);
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe('Choose a new password');
    // Too short first: the field says so and nothing is used up.
    await page.getByLabel('New password', { exact: true }).fill('short');
    await page.getByLabel('New password again').fill('short');
    await page.getByRole('button', { name: 'Set the new password' }).click();
    await expect.poll(() => page.getByText('The password needs at least 10 characters.').count()).toBe(1);
    await page.getByLabel('New password', { exact: true }).fill(newPassword);
    await page.getByLabel('New password again').fill(newPassword);
    await page.getByRole('button', { name: 'Set the new password' }).click();
    await expect.poll(() => page.getByText('Password changed').count()).toBe(1);

    await page.getByRole('link', { name: 'Sign in' }).last().click();
    await page.getByLabel('E-mail address').fill(person.email);
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await expect
      .poll(() => page.getByRole('alert').filter({ hasText: /wrong/ }).textContent())
      .toBe('The e-mail address or the password is wrong.');
    await page.getByLabel('Password').fill(newPassword);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(`${web.baseUrl}/`);
    await expect.poll(() => page.getByRole('banner').textContent()).toContain(person.displayName);
    await page.close();
  });
});
