import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { type BrowserContext, chromium } from 'playwright-core';

/** Debian's Chromium, which `npm test` installs when missing. */
export const CHROMIUM_PATH = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

/** Launches headless Chromium with its own throwaway profile; `close` removes the profile. */
export async function launchBrowser(): Promise<{ context: BrowserContext; close: () => Promise<void> }> {
  if (!existsSync(CHROMIUM_PATH))
    throw new Error(`no Chromium at ${CHROMIUM_PATH}: npm test installs Debian's chromium package`);
  const profile = mkdtempSync(join(tmpdir(), 'leadline-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM_PATH,
    headless: true,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
  return {
    context,
    close: async () => {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}
