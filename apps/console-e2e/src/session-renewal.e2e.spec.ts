import type { Browser, Page } from 'playwright-core';
import { launchBrowser } from './support/browser';
import { signInAs } from './support/console-sign-in';
import { DEMO_PASSWORD, startTallyfit, type RunningServer } from './support/tallyfit-server';

const SESSION_KEY = 'tallyfit.session';

interface StoredSession {
  accessToken: string;
  expiresAt: number;
  refreshToken?: string;
}

describe('a session that runs out is renewed, or ends with the way back remembered', () => {
  let server: RunningServer;
  let browser: Browser;
  let page: Page;

  beforeAll(async () => {
    [server, browser] = await Promise.all([startTallyfit(), launchBrowser()]);
    page = await browser.newPage({ viewport: { width: 1280, height: 800 } });
    page.setDefaultTimeout(10_000);
    await signInAs(page, server.url, 'lead', '/studies');
  });

  afterAll(async () => {
    await browser?.close();
    await server?.stop();
  });

  const readSession = () => page.evaluate((key) => JSON.parse(sessionStorage.getItem(key) ?? 'null') as StoredSession | null, SESSION_KEY);
  const changeSession = (change: Partial<StoredSession>) =>
    page.evaluate(
      ([key, patch]) => sessionStorage.setItem(key, JSON.stringify({ ...JSON.parse(sessionStorage.getItem(key) ?? '{}'), ...patch })),
      [SESSION_KEY, change] as const,
    );

  it('renews an access token that has run out with the refresh token, without asking the person', async () => {
    const before = await readSession();
    expect(before?.refreshToken).toBeTruthy();
    // The access token is still valid for the API, but the console believes it ran out a minute ago.
    await changeSession({ expiresAt: Date.now() - 60_000 });
    const refreshed = page.waitForResponse((response) => response.url().endsWith('/api/v1/auth/refresh') && response.status() === 200);
    await page.goto(`${server.url}/history`);
    await refreshed;
    await page.locator('table tbody tr').first().waitFor();
    const after = await readSession();
    // Refresh tokens are used once: the answer brings a new one. (A new access token signed within
    // the same second carries the same claims, so it may equal the old one.)
    expect(after?.refreshToken).not.toBe(before?.refreshToken);
    expect(after!.expiresAt).toBeGreaterThan(Date.now());
  });

  it('answers a refused token with one refresh and a retry', async () => {
    await changeSession({ accessToken: 'no-longer-good' });
    const refreshed = page.waitForResponse((response) => response.url().endsWith('/api/v1/auth/refresh') && response.status() === 200);
    await page.goto(`${server.url}/admin/audit`);
    await refreshed;
    await page.locator('table.events tbody tr').first().waitFor();
    expect(new URL(page.url()).pathname).toBe('/admin/audit');
  });

  it('sends the person to sign in when the session cannot be renewed, and back afterwards', async () => {
    await changeSession({ accessToken: 'no-longer-good', refreshToken: 'revoked-or-unknown' });
    await page.goto(`${server.url}/history?status=in_review`);
    await page.getByRole('heading', { name: 'Sign in to Tallyfit' }).waitFor();
    await page.getByText('Your session has ended. Sign in again to continue.').waitFor();
    const url = new URL(page.url());
    expect(url.pathname).toBe('/sign-in');
    expect(url.searchParams.get('returnUrl')).toBe('/history?status=in_review');

    await page.getByLabel('E-mail').fill('lead@demo.tallyfit.local');
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL((back) => back.pathname === '/history' && back.searchParams.get('status') === 'in_review');
  });

  it('forgets the refresh token on the server when the person signs out', async () => {
    const { refreshToken } = (await readSession())!;
    await page.getByRole('button', { name: /^Your account/ }).click();
    await page.getByRole('menuitem', { name: 'Sign out' }).click();
    await page.getByRole('heading', { name: 'Sign in to Tallyfit' }).waitFor();
    const reuse = await fetch(`${server.url}/api/v1/auth/refresh`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify({ refreshToken }),
    });
    expect(reuse.status).toBe(401);
  });
});
