import { execFileSync } from 'node:child_process';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser, screenshot } from './support/browser';
import { signInAs } from './support/console-sign-in';
import { settle } from './support/settle';
import { startTallyfit, type RunningServer } from './support/tallyfit-server';

// An invented scenario: a café checks that its three tills took equal shares of the morning's orders.
const TITLE = 'Morning orders by till';
const NOTES = 'Orders from 7 to 11 on 1 December, from the till log.';
const FIRST_COUNTS = 'till 1\t88\ntill 2\t64\ntill 3\t48';
const CHANGED_COUNTS = 'till 1\t80\ntill 2\t64\ntill 3\t56';
const REASON = 'Till 3 was closed from 10 to 11; use the counts without that hour and run it again.';

/** Screenshots of the page as it is, at desktop width and at phone width, then back to desktop. */
async function bothWidths(page: Page, name: string): Promise<void> {
  await settle(page);
  await screenshot(page, `${name}-1280`);
  await page.setViewportSize({ width: 390, height: 844 });
  await settle(page);
  await screenshot(page, `${name}-390`);
  await page.setViewportSize({ width: 1280, height: 800 });
  // Back at desktop width the flow's stepper redraws from vertical to horizontal; let it finish first.
  await settle(page);
}

const bell = (page: Page) => page.getByTestId('notification-bell');

describe('the review loop: run, submit, return, change, re-run, resubmit, sign off', () => {
  let server: RunningServer;
  let browser: Browser;
  let analyst: Page;
  let lead: Page;
  let firstId: number;
  let secondId: number;

  beforeAll(async () => {
    [server, browser] = await Promise.all([startTallyfit(), launchBrowser()]);
    // Two people at two computers: separate contexts keep their sessions apart.
    analyst = await (await browser.newContext({ viewport: { width: 1280, height: 800 }, reducedMotion: 'reduce' })).newPage();
    lead = await (await browser.newContext({ viewport: { width: 1280, height: 800 }, reducedMotion: 'reduce', acceptDownloads: true })).newPage();
  });

  afterAll(async () => {
    await browser?.close();
    await server?.stop();
  });

  it('the analyst runs an analysis with notes and submits it for review', async () => {
    await signInAs(analyst, server.url, 'analyst', '/analyses/new');
    await analyst.getByRole('radio', { name: 'Paste two columns' }).click();
    await analyst.getByLabel('Categories and counts').fill(FIRST_COUNTS);
    for (const step of ['What was expected', 'Tests and options', 'Run']) {
      await analyst.getByRole('button', { name: 'Next', exact: true }).filter({ visible: true }).click();
      await analyst.getByRole('tab', { name: step, selected: true }).waitFor();
    }
    await analyst.getByLabel('Title').fill(TITLE);
    await analyst.getByLabel('Notes').fill(NOTES);
    await bothWidths(analyst, 'review-loop-new-analysis-notes');
    await analyst.getByRole('button', { name: 'Run the test' }).click();
    await analyst.getByRole('heading', { name: TITLE, level: 1 }).waitFor();
    firstId = Number(new URL(analyst.url()).pathname.split('/').pop());
    await expect(analyst.getByTestId('analysis-notes').textContent()).resolves.toBe(NOTES);

    await analyst.getByRole('button', { name: 'Submit for review' }).click();
    await analyst.getByTestId('review-state').getByText('Review state: Waiting for review.').waitFor();
    await analyst.getByRole('button', { name: 'Withdraw submission' }).waitFor();
    await bothWidths(analyst, 'review-loop-submitted');
  });

  it('the lead lands on the review queue, sees the bell count, and opens the work from the bell', async () => {
    await signInAs(lead, server.url, 'lead', '/studies');
    // Home, for a lead, is the review queue rather than an empty list of their own analyses.
    await lead.getByRole('link', { name: 'Tallyfit home' }).click();
    await lead.getByRole('heading', { name: 'To review' }).waitFor();
    expect(new URL(lead.url()).pathname).toBe('/reviews');
    await lead.getByRole('link', { name: TITLE }).waitFor();
    await bell(lead).and(lead.getByLabel('Notifications, 1 unread')).waitFor();
    await bothWidths(lead, 'review-loop-queue');

    await bell(lead).click();
    const item = lead.getByRole('menuitem', { name: `Ana Analyst submitted "${TITLE}" for review` });
    await item.waitFor();
    await settle(lead);
    await screenshot(lead, 'review-loop-bell-menu-1280');
    await item.click();
    await lead.waitForURL(`**/analyses/${firstId}`);
    await bell(lead).and(lead.getByLabel('Notifications, none unread')).waitFor();
  });

  it('the lead returns it with a note from the result page, with the effect size in view, and comments', async () => {
    const decision = lead.getByRole('group', { name: 'Your decision' });
    await expect(decision.textContent()).resolves.toMatch(/Effect size: Cohen's w = 0\.\d+/);
    await decision.getByRole('button', { name: 'Return to the author' }).click();
    await decision.getByText('Say what the author should change before returning the analysis.').waitFor();
    await decision.getByLabel('Note for the author').fill(REASON);
    await bothWidths(lead, 'review-loop-lead-decides');
    await decision.getByRole('button', { name: 'Return to the author' }).click();
    await lead.getByTestId('review-state').getByText('Review state: Returned for changes.').waitFor();
    await lead.getByLabel('Add a comment').fill('The other two tills look fine to me.');
    await lead.getByRole('button', { name: 'Post comment' }).click();
    await lead.getByText('The other two tills look fine to me.').last().waitFor();
  });

  it('the analyst is told (the bell polls), reads the reason, and changes the counts and re-runs as a new version', async () => {
    // No reload: the bell's next poll (every 30 s) brings the news.
    await bell(analyst).and(analyst.getByLabel('Notifications, 1 unread')).waitFor({ timeout: 40_000 });
    await bell(analyst).click();
    await analyst.getByRole('menuitem', { name: `Lee Lead returned "${TITLE}" for changes` }).click();
    await analyst.getByTestId('return-note').getByText(REASON).waitFor();
    await analyst.getByText('The other two tills look fine to me.').waitFor();
    await bothWidths(analyst, 'review-loop-returned');

    await analyst.getByRole('link', { name: 'Change and re-run' }).click();
    await analyst.getByRole('heading', { name: 'Change and re-run' }).waitFor();
    const counts = analyst.getByLabel('Categories and counts');
    await expect(counts.inputValue()).resolves.toBe(FIRST_COUNTS);
    await bothWidths(analyst, 'review-loop-change-and-rerun');
    await counts.fill(CHANGED_COUNTS);
    for (const step of ['What was expected', 'Tests and options', 'Run']) {
      await analyst.getByRole('button', { name: 'Next', exact: true }).filter({ visible: true }).click();
      await analyst.getByRole('tab', { name: step, selected: true }).waitFor();
    }
    await expect(analyst.getByLabel('Title').inputValue()).resolves.toBe(TITLE);
    await expect(analyst.getByLabel('Notes').inputValue()).resolves.toBe(NOTES);
    await analyst.getByRole('button', { name: 'Run as version 2' }).click();
    await analyst.waitForURL((url) => /^\/analyses\/\d+$/.test(url.pathname) && url.pathname !== `/analyses/${firstId}`);
    secondId = Number(new URL(analyst.url()).pathname.split('/').pop());
    await analyst.getByText('version 2').first().waitFor();
    await analyst.getByRole('button', { name: 'Submit for review' }).click();
    await analyst.getByTestId('review-state').getByText('Review state: Waiting for review.').waitFor();
  });

  it('the lead finds the new version in the queue and signs it off', async () => {
    await lead.getByRole('link', { name: 'To review' }).first().click();
    await lead.getByRole('heading', { name: 'To review' }).waitFor();
    await bell(lead).and(lead.getByLabel('Notifications, 1 unread')).waitFor();
    await lead.getByRole('button', { name: `Review ${TITLE}` }).click();
    await lead.waitForURL(`**/analyses/${secondId}`);
    const decision = lead.getByRole('group', { name: 'Your decision' });
    await decision.getByLabel('Note for the author').fill('Thank you; signed off.');
    await decision.getByRole('button', { name: 'Sign off' }).click();
    await lead.getByTestId('review-state').getByText(/Signed off by Lee Lead on \d{4}-\d\d-\d\d \d\d:\d\d UTC\./).waitFor();
    await bothWidths(lead, 'review-loop-signed-off');
  });

  it('the PDF report shows the sign-off, in the words of the page', async () => {
    const [download] = await Promise.all([lead.waitForEvent('download'), lead.getByRole('button', { name: 'PDF' }).click()]);
    const path = await download.path();
    const text = execFileSync('pdftotext', ['-layout', path, '-'], { encoding: 'utf8' });
    const onPage = await lead.getByTestId('review-state').locator('li').allTextContents();
    expect(onPage[0]).toBe('Review state: Signed off.');
    for (const line of onPage) expect(text).toContain(line.trim());
  });

  it('the analyst hears of the sign-off and sees the review state in My analyses and on the notifications page', async () => {
    await analyst.reload();
    await bell(analyst).and(analyst.getByLabel('Notifications, 1 unread')).waitFor();
    await analyst.getByRole('link', { name: 'My analyses' }).first().click();
    const row = analyst.locator('table tbody tr', { hasText: TITLE }).first();
    await row.getByText('Signed off').waitFor();
    await bothWidths(analyst, 'review-loop-my-analyses');
    await analyst.goto(`${server.url}/notifications`);
    await analyst.getByRole('link', { name: `Lee Lead signed off "${TITLE}"` }).waitFor();
    await bothWidths(analyst, 'review-loop-notifications');
  });
});
