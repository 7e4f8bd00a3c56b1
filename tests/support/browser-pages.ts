import type { BrowserContext, Page } from 'playwright-core';
import { expect } from 'vitest';

/** Signs in through the sign-in page and waits until the header offers to sign out. */
export async function signInThroughPage(page: Page, baseUrl: string, email: string, password: string): Promise<void> {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail address').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect.poll(() => page.getByRole('button', { name: 'Sign out' }).count()).toBe(1);
}

/** Pixels of a canvas that differ from the white background, and those close to the highlight sand (#f2c879). */
export function canvasPixels(page: Page, testId: string): Promise<{ inked: number; highlight: number; total: number }> {
  return page.getByTestId(testId).evaluate((element) => {
    const canvas = element as HTMLCanvasElement;
    const ctx = canvas.getContext('2d');
    if (ctx === null) return { inked: 0, highlight: 0, total: 0 };
    const { data } = ctx.getImageData(0, 0, canvas.width, canvas.height);
    let inked = 0;
    let highlight = 0;
    for (let i = 0; i < data.length; i += 4) {
      const r = data[i] as number;
      const g = data[i + 1] as number;
      const b = data[i + 2] as number;
      if (r < 235 || g < 235 || b < 235) inked++;
      if (Math.abs(r - 0xf2) < 6 && Math.abs(g - 0xc8) < 6 && Math.abs(b - 0x79) < 6) highlight++;
    }
    return { inked, highlight, total: data.length / 4 };
  });
}

/**
 * A new page at 1280 × 900 that keeps every URL it requests and every uncaught script error, for a
 * test to check that nothing failed and no other host was asked.
 */
export async function openWatchedPage(
  context: BrowserContext,
): Promise<{ page: Page; requested: string[]; pageErrors: string[] }> {
  const page = await context.newPage();
  await page.setViewportSize({ width: 1280, height: 900 });
  const requested: string[] = [];
  page.on('request', (request) => requested.push(request.url()));
  const pageErrors: string[] = [];
  page.on('pageerror', (error) => pageErrors.push(error.message));
  return { page, requested, pageErrors };
}
