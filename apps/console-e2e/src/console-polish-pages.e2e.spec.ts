import type { Browser, Page } from 'playwright-core';
import { launchBrowser, screenshot } from './support/browser';
import { signInAs } from './support/console-sign-in';
import { startTallyfit, type RunningServer } from './support/tallyfit-server';

/** Screenshots of the pages this round changed (result page's categories table, planner, tokens, API docs) at desktop and phone widths. */
describe('changed pages at 1280 and 390 wide', () => {
  let server: RunningServer;
  let browser: Browser;
  let page: Page;

  beforeAll(async () => {
    [server, browser] = await Promise.all([startTallyfit(), launchBrowser()]);
    page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
    await signInAs(page, server.url, 'analyst');
  });
  afterAll(async () => {
    await browser?.close();
    await server?.stop();
  });

  for (const width of [1280, 390]) {
    it(`shows the categories table in our own words at ${width}px`, async () => {
      await page.setViewportSize({ width, height: 900 });
      await page.goto(`${server.url}/analyses/1`);
      await page.getByText('Gap in standard errors').first().waitFor();
      expect(await page.getByText('Gap in standard errors').count()).toBeGreaterThan(0);
      await screenshot(page, `polish-result-${width}`);
      await page.goto(`${server.url}/api/docs/`);
      await page.locator('.swagger-ui .info .title').first().waitFor();
      await page.waitForTimeout(500);
      expect(await page.title()).toContain('Tallyfit');
      await screenshot(page, `polish-api-docs-${width}`);
    });
  }
});
