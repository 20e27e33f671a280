import type { Browser, Page } from 'playwright-core';
import { launchBrowser, screenshot } from './support/browser';
import { settle } from './support/settle';
import { signInAs } from './support/console-sign-in';
import { DemoApi } from './support/demo-api';
import { startTallyfit, type RunningServer } from './support/tallyfit-server';

const TITLE = 'Loyalty mailing: did the four regions reply equally?';

describe('a lead finds an analysis waiting for review in History and signs it off', () => {
  let server: RunningServer;
  let browser: Browser;
  let page: Page;
  let analysisId: number;

  beforeAll(async () => {
    [server, browser] = await Promise.all([startTallyfit(), launchBrowser()]);
    // The demo analyst runs an analysis in the demo study and submits it, as a pipeline would.
    const analyst = await DemoApi.signIn(server.url, 'analyst');
    const [study] = await analyst.expectOk<{ id: number }[]>('GET', '/studies');
    const analysis = await analyst.expectOk<{ id: number }>('POST', '/analyses', {
      title: TITLE,
      studyId: study.id,
      spec: { observed: { labels: ['north', 'south', 'east', 'west'], counts: [131, 118, 97, 154] }, hypothesis: { kind: 'equal' } },
    });
    analysisId = analysis.id;
    await analyst.expectOk('POST', `/analyses/${analysisId}/submit`, { comment: 'Ready for a look.' });
    page = await browser.newPage({ viewport: { width: 1280, height: 800 } });
  });

  afterAll(async () => {
    await browser?.close();
    await server?.stop();
  });

  it('narrows the history to analyses waiting for review with the given words', async () => {
    await signInAs(page, server.url, 'lead', '/history');
    await page.getByRole('heading', { name: 'History' }).waitFor();
    await page.getByRole('button', { name: 'Only those waiting for review' }).click();
    await page.waitForURL(/status=in_review/);
    await page.getByLabel('Search titles and notes').fill('loyalty mailing');
    await page.waitForURL(/q=loyalty/);
    const rows = page.locator('table tbody tr');
    await page.getByText('1 analysis', { exact: true }).waitFor();
    await expect(rows.count()).resolves.toBe(1);
    await expect(rows.first().textContent()).resolves.toContain(TITLE);
    await settle(page);
    await screenshot(page, 'history-filtered-1280');
  });

  it('keeps the view in the address, so a bookmark opens the same list', async () => {
    const bookmarked = page.url();
    await page.goto(`${server.url}/studies`);
    await page.goto(bookmarked);
    await page.getByText('1 analysis', { exact: true }).waitFor();
    await expect(page.getByLabel('Search titles and notes').inputValue()).resolves.toBe('loyalty mailing');
    await expect(page.getByRole('button', { name: 'Only those waiting for review' }).getAttribute('aria-pressed')).resolves.toBe('true');
  });

  it('signs the analysis off from the review dialog with a note', async () => {
    await page.getByRole('button', { name: `Review ${TITLE}` }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByText('Ana Analyst submitted it for review').waitFor();
    await dialog.getByText('Ready for a look.').waitFor();
    await dialog.getByLabel('Note for the author').fill('Clear write-up; signed off.');
    await settle(page);
    await screenshot(page, 'history-review-dialog-1280');
    await dialog.getByRole('button', { name: 'Sign off' }).click();
    await dialog.getByText('Lee Lead signed it off').waitFor();
    await expect(dialog.getByRole('button', { name: 'Sign off' }).count()).resolves.toBe(0);
    await dialog.getByRole('button', { name: 'Close' }).click();
    // Still filtered on "waiting for review", the signed-off analysis has left the list.
    await page.getByText('No analysis matches these filters.').waitFor();
  });

  it('is stored as signed off, with the lead’s note in its review record', async () => {
    const lead = await DemoApi.signIn(server.url, 'lead');
    const analysis = await lead.expectOk<{ status: string }>('GET', `/analyses/${analysisId}`);
    expect(analysis.status).toBe('signed_off');
    const reviews = await lead.expectOk<{ decision: string; comment: string | null }[]>('GET', `/analyses/${analysisId}/reviews`);
    expect(reviews.map((review) => [review.decision, review.comment])).toEqual([
      ['submitted', 'Ready for a look.'],
      ['signed_off', 'Clear write-up; signed off.'],
    ]);
  });
});
