import { afterAll, describe, expect, it } from 'vitest';
import { createTestPerson, type TestPerson } from '../../server/src/auth/auth-test-support.js';
import { openBrowser, submitSignIn, type BrowserSession } from '../support/browser.js';
import { startServer, type RunningServer } from '../support/running-server.js';
import { useTestDatabase, type TestDatabase } from '../support/test-database.js';

describe('signing in to the console in Chromium', () => {
  let db: TestDatabase;
  let server: RunningServer;
  let browser: BrowserSession;
  let supervisor: TestPerson;

  useTestDatabase(async (made) => {
    db = made;
    server = await startServer(db);
    supervisor = await createTestPerson('supervisor');
    browser = await openBrowser();
  });

  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });

  async function signIn(userName: string, password: string) {
    const page = await browser.context.newPage();
    await browser.context.clearCookies();
    await page.goto(`${server.baseUrl}/sign-in`);
    await submitSignIn(page, userName, password);
    return page;
  }

  it('signs a person in through the CSRF-protected session route and opens Runs', async () => {
    const page = await signIn(supervisor.userName, supervisor.password);
    await page.waitForURL(/\/runs$/);
    const cookies = await browser.context.cookies(server.baseUrl);
    expect(cookies.find((c) => c.name === 'XSRF-TOKEN')?.httpOnly).toBe(false);
    expect(cookies.some((c) => c.httpOnly && c.name !== 'XSRF-TOKEN')).toBe(true);
    await page.close();
  });

  it('keeps the form and says so when the password is wrong', async () => {
    const page = await signIn(supervisor.userName, 'not-the-password');
    await expect(page.getByTestId('sign-in-error').textContent({ timeout: 10_000 })).resolves.toContain('not recognised');
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await page.close();
  });
});
