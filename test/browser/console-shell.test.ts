/// <reference lib="dom" />
/// <reference lib="dom.iterable" />
import { afterAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { createTestPerson } from '../../server/src/auth/auth-test-support.js';
import { openBrowser, submitSignIn, type BrowserSession } from '../support/browser.js';
import { startServer, type RunningServer } from '../support/running-server.js';
import { useTestDatabase, type TestDatabase } from '../support/test-database.js';

interface FontState {
  family: string;
  status: string;
}

describe('the built console in Chromium', () => {
  let db: TestDatabase;
  let server: RunningServer;
  let browser: BrowserSession;
  let page: Page;
  const requested: string[] = [];
  const fontResponses: string[] = [];
  let fonts: FontState[] = [];

  useTestDatabase(async (made) => {
    db = made;
    server = await startServer(db);
    browser = await openBrowser();
    page = await browser.context.newPage();
    page.on('request', (r) => requested.push(r.url()));
    page.on('response', (r) => {
      if (/\.(woff2?|ttf)(\?|$)/.test(r.url()) && r.ok()) fontResponses.push(r.url());
    });
    // A signed-out visitor lands on the sign-in page; the shell opens once a person signs in.
    const viewer = await createTestPerson('viewer');
    await page.goto(`${server.baseUrl}/`);
    await page.waitForURL(/\/sign-in/);
    await submitSignIn(page, viewer.userName, viewer.password);
    await page.getByTestId('shell-title').waitFor();
    // Fonts load when first used; the icon font only once the lazy area page has drawn its icons.
    await page
      .waitForFunction(
        (families) => families.every((family) => [...document.fonts].some((f) => f.family.replace(/"/g, '') === family && f.status === 'loaded')),
        ['Fira Sans', 'Material Symbols Outlined'],
        { timeout: 15_000 },
      )
      .catch(() => undefined); // the assertions below say which font is missing
    fonts = await page.evaluate(() => [...document.fonts].map((f) => ({ family: f.family.replace(/"/g, ''), status: f.status })));
  });

  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });

  it('renders the shell with the product name and the navigation', async () => {
    await expect(page.getByTestId('shell-title').textContent()).resolves.toContain('Clinometer');
    await expect(page.getByTestId('nav').isVisible()).resolves.toBe(true);
  });

  it('loads Fira Sans and the icon font from the app itself', () => {
    expect(fonts.some((f) => f.family === 'Fira Sans' && f.status === 'loaded')).toBe(true);
    expect(fonts.some((f) => f.family === 'Material Symbols Outlined' && f.status === 'loaded')).toBe(true);
    expect(fontResponses.length).toBeGreaterThanOrEqual(2);
    for (const url of fontResponses) expect(new URL(url).origin).toBe(server.baseUrl);
  });

  it('sends no request outside the app origin', () => {
    expect(requested.length).toBeGreaterThan(0);
    const outside = requested.filter((u) => !u.startsWith(`${server.baseUrl}/`) && !u.startsWith('data:'));
    expect(outside).toEqual([]);
  });
});
