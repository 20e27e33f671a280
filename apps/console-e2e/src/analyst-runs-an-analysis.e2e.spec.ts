import type { Browser, Page } from 'playwright-core';
import { launchBrowser, screenshot } from './support/browser';
import { DEMO_PASSWORD, startTallyfit, type RunningServer } from './support/tallyfit-server';

describe('an analyst signs in, runs a test and finds it saved', () => {
  let server: RunningServer;
  let browser: Browser;
  let page: Page;
  const outsideRequests: string[] = [];

  beforeAll(async () => {
    [server, browser] = await Promise.all([startTallyfit(), launchBrowser()]);
    page = await browser.newPage({ viewport: { width: 1280, height: 800 } });
    page.on('request', (request) => {
      if (!request.url().startsWith(server.url) && !request.url().startsWith('data:')) outsideRequests.push(request.url());
    });
  });

  afterAll(async () => {
    await browser?.close();
    await server?.stop();
  });

  it('sends a visitor to the sign-in page', async () => {
    await page.goto(server.url);
    await page.getByRole('heading', { name: 'Sign in to Tallyfit' }).waitFor();
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await screenshot(page, '01-sign-in');
  });

  it('refuses a wrong password with the API message', async () => {
    await page.getByLabel('E-mail').fill('analyst@demo.tallyfit.local');
    await page.getByLabel('Password').fill('not-the-password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await expect(page.getByRole('alert').textContent()).resolves.toContain('e-mail or password is wrong');
  });

  it('signs the demo analyst in and lists the seeded analyses', async () => {
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('heading', { name: 'My analyses' }).waitFor();
    await page.getByRole('link', { name: 'Help-desk tickets by weekday' }).waitFor();
    await screenshot(page, '02-my-analyses');
  });

  it('runs Pearson’s test on typed counts and shows the published values', async () => {
    await page.getByRole('link', { name: 'New analysis' }).first().click();
    await page.getByRole('heading', { name: 'New analysis' }).waitFor();
    await page.getByRole('textbox', { name: 'Category 1', exact: true }).fill('green');
    await page.getByRole('textbox', { name: 'Category 2', exact: true }).fill('yellow');
    const counts = page.getByRole('spinbutton', { name: 'Observed count' });
    await counts.nth(0).fill('1752');
    await counts.nth(1).fill('1895');
    await screenshot(page, '03-new-analysis');
    // The guided flow: counts → what was expected (equal shares by default) → tests and options → run.
    // Each step's header is selected before the next click, so no click lands on a step sliding away.
    for (const step of ['What was expected', 'Tests and options', 'Run']) {
      await page.getByRole('button', { name: 'Next', exact: true }).filter({ visible: true }).click();
      await page.getByRole('tab', { name: step, selected: true }).waitFor();
    }
    await page.getByLabel('Title').fill('Seedling colour against a 1:1 split');
    await page.getByRole('button', { name: 'Run the test' }).click();

    await page.getByRole('heading', { name: 'Seedling colour against a 1:1 split' }).waitFor();
    // McDonald, Handbook of Biological Statistics, 3rd ed. (2014), chi-square test of goodness-of-fit:
    // 1752 vs 1895 under 1:1 gives X² = 5.61, 1 df, p = 0.0179.
    await expect(page.getByTestId('statistic').textContent()).resolves.toBe('5.61');
    await expect(page.getByTestId('df').textContent()).resolves.toBe('1');
    await expect(page.getByTestId('p').textContent()).resolves.toBe('= .018');
    await expect(page.getByRole('heading', { name: 'The observed counts differ from what was expected.' }).count()).resolves.toBe(1);
    await screenshot(page, '04-result');
  });

  it('lists the new analysis first among the analyst’s own', async () => {
    await page.getByRole('link', { name: 'My analyses' }).click();
    const firstRowTitle = page.locator('table tbody tr').first().locator('td').first();
    await expect(firstRowTitle.textContent()).resolves.toContain('Seedling colour against a 1:1 split');
  });

  it('loads nothing from outside the machine (fonts and scripts are self-hosted)', () => {
    expect(outsideRequests).toEqual([]);
  });
});
