import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';

/** Debian's Chromium, headless, with the flags that keep it off the network. */
export const chromiumArgs = [
  '--no-sandbox',
  '--disable-gpu',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--no-first-run',
  '--disable-quic',
];

export interface BrowserSession {
  context: BrowserContext;
  close(): Promise<void>;
}

export async function openBrowser(): Promise<BrowserSession> {
  const profile = await mkdtemp(path.join(tmpdir(), 'clino-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    args: chromiumArgs,
    viewport: { width: 1280, height: 800 },
  });
  return {
    context,
    async close() {
      await context.close();
      await rm(profile, { recursive: true, force: true });
    },
  };
}

/** Fills and sends the console's sign-in form on the page (already at /sign-in or redirected there). */
export async function submitSignIn(page: Page, userName: string, password: string): Promise<void> {
  await page.locator('[data-testid="sign-in-username"] input, input[data-testid="sign-in-username"]').first().fill(userName);
  await page.locator('[data-testid="sign-in-password"] input, input[data-testid="sign-in-password"]').first().fill(password);
  await page.getByTestId('sign-in-submit').click();
}
