import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { seriousAxeViolations } from './support/axe-check';
import { launchBrowser, screenshot } from './support/browser';
import { signInAs } from './support/console-sign-in';
import { DemoApi } from './support/demo-api';
import { tabTo } from './support/keyboard';
import { startTallyfit, type RunningServer } from './support/tallyfit-server';

/**
 * An invented month of defects on a packaging line: one row per inspected defect. Against the
 * line's usual mix (shares below) the rare kinds are expected only a few times each, so the
 * assumption check fails and proposes merging them.
 */
const USUAL_MIX: Record<string, number> = { scratch: 0.4, dent: 0.3, stain: 0.2, crack: 0.05, chip: 0.03, warp: 0.02 };
const OBSERVED: Record<string, number> = { scratch: 38, dent: 27, stain: 21, crack: 9, chip: 3, warp: 2 };

function defectsCsv(): string {
  const rows = ['unit,shift,defect'];
  let unit = 1000;
  for (const [defect, count] of Object.entries(OBSERVED)) {
    for (let i = 0; i < count; i++) rows.push(`${unit++},${i % 2 === 0 ? 'early' : 'late'},${defect}`);
  }
  return rows.join('\n') + '\n';
}

describe('an analyst uploads a file, fixes a failed assumption, downloads and shares the report', () => {
  let server: RunningServer;
  let browser: Browser;
  let page: Page;
  let folder: string;
  let csvPath: string;
  let analysisUrl = '';

  beforeAll(async () => {
    [server, browser] = await Promise.all([startTallyfit(), launchBrowser()]);
    folder = mkdtempSync(join(tmpdir(), 'tallyfit-workbench-'));
    csvPath = join(folder, 'line-3-defects.csv');
    writeFileSync(csvPath, defectsCsv());
    // bypassCSP lets the accessibility check inject axe-core; the console itself runs under the API's CSP.
    // Reduced motion makes the stepper's slide instant, so screenshots show settled pages.
    page = await browser.newPage({ viewport: { width: 1280, height: 800 }, acceptDownloads: true, bypassCSP: true, reducedMotion: 'reduce' });
    await signInAs(page, server.url, 'analyst', '/analyses/new');
  });

  afterAll(async () => {
    await browser?.close();
    await server?.stop();
    if (folder) rmSync(folder, { recursive: true, force: true });
  });

  /** Goes on to the named step and waits until its header is selected. */
  const next = async (step: string) => {
    await page.getByRole('button', { name: 'Next', exact: true }).filter({ visible: true }).click();
    await page.getByRole('tab', { name: step, selected: true }).waitFor();
  };

  it('uploads the CSV with a progress bar and counts the chosen column before running', async () => {
    await page.getByRole('heading', { name: 'New analysis' }).waitFor();
    await page.getByRole('radio', { name: 'Upload a file' }).click();
    await page.getByRole('combobox', { name: 'Study the file belongs to' }).click();
    await page.getByRole('option', { name: 'Bramblewick Goods storefront checks' }).click();
    await page.locator('tf-dataset-upload input[type="file"]').setInputFiles(csvPath);
    await page.getByText('Stored line-3-defects.csv: 100 rows, 3 columns.').waitFor();
    await page.getByRole('combobox', { name: 'Column with the category' }).click();
    await page.getByRole('option', { name: 'defect' }).click();
    await page.getByRole('button', { name: 'Count the categories' }).click();
    await page.getByText('100 observations in 6 categories.').waitFor();
    await screenshot(page, 'workbench-01-upload-1280');
    expect(await seriousAxeViolations(page)).toEqual([]);
  });

  it('states the usual mix and sees the expected counts before running', async () => {
    await next('What was expected');
    await page.getByRole('radio', { name: 'A share for each category' }).check();
    for (const [defect, share] of Object.entries(USUAL_MIX)) {
      await page.getByRole('spinbutton', { name: defect, exact: true }).fill(String(share));
    }
    await page.getByText('The shares add up to 1.').waitFor();
    // 100 observations × 0.02 = 2 expected warps (arithmetic).
    const warp = page.getByTestId('expected-preview').getByRole('row', { name: /^warp/ });
    await expect(warp.textContent()).resolves.toContain('2.00');
    await screenshot(page, 'workbench-02-hypothesis-1280');
    await next('Tests and options');
    await screenshot(page, 'workbench-03-options-1280');
    await next('Run');
    await page.getByLabel('Title').fill('Line 3 defects against the usual mix');
    await screenshot(page, 'workbench-04-run-1280');
    await page.getByRole('button', { name: 'Run the test' }).click();
    await page.getByRole('heading', { name: 'Line 3 defects against the usual mix' }).waitFor();
    analysisUrl = page.url();
  });

  it('shows the failed assumption check with the proposed merge', async () => {
    await page.getByText('Some expected counts are too small').waitFor();
    await expect(page.getByRole('list', { name: 'Proposed merge' }).textContent()).resolves.toContain('“chip”');
    // The charts and the write-up load when they scroll into view.
    await page.getByRole('heading', { name: 'Charts' }).scrollIntoViewIfNeeded();
    await page.getByTestId('shares-chart').locator('svg').waitFor();
    await page.getByTestId('residuals-chart').locator('svg').waitFor();
    await page.getByRole('heading', { name: 'Write-up' }).scrollIntoViewIfNeeded();
    await page.locator('tf-write-up markdown h2').first().waitFor();
    await screenshot(page, 'workbench-05-result-1280');
    expect(await seriousAxeViolations(page)).toEqual([]);
  });

  it('saves a chart as SVG and as PNG', async () => {
    const sharesChart = page.locator('figure').filter({ has: page.getByTestId('shares-chart') });
    const [svg] = await Promise.all([page.waitForEvent('download'), sharesChart.getByRole('button', { name: 'SVG' }).click()]);
    expect(svg.suggestedFilename()).toMatch(/^analysis-\d+-shares\.svg$/);
    expect(readFileSync((await svg.path())!, 'utf8')).toContain('<svg');
    const [png] = await Promise.all([page.waitForEvent('download'), sharesChart.getByRole('button', { name: 'PNG' }).click()]);
    expect(png.suggestedFilename()).toMatch(/^analysis-\d+-shares\.png$/);
    // A PNG file starts with the bytes 0x89 "PNG".
    expect(readFileSync((await png.path())!).subarray(1, 4).toString('latin1')).toBe('PNG');
  });

  it('merges the sparse categories as a new version and says what changed', async () => {
    await page.getByRole('button', { name: 'Merge these and run again' }).click();
    await page.getByRole('heading', { name: 'What changed since version 1' }).waitFor();
    await expect(page.locator('.meta').textContent()).resolves.toContain('version 2');
    await expect(page.getByText('Some expected counts are too small').count()).resolves.toBe(0);
    await screenshot(page, 'workbench-06-merged-1280');
  });

  it('downloads the report as Markdown and PDF, and the categories as CSV', async () => {
    const [markdown] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Markdown', exact: true }).click()]);
    const report = readFileSync((await markdown.path())!, 'utf8');
    expect(report).toContain('Line 3 defects against the usual mix');
    expect(report).toMatch(/[Mm]erged/);
    const [pdf] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'PDF' }).click()]);
    expect(readFileSync((await pdf.path())!).subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const [csv] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Categories as CSV' }).click()]);
    expect(readFileSync((await csv.path())!, 'utf8').split('\n')[0].toLowerCase()).toContain('counted');
  });

  it('shares the report by e-mail and the mail arrives in the stand-in’s inbox', async () => {
    await page.getByRole('button', { name: 'Share by e-mail' }).click();
    await page.getByRole('dialog').getByLabel('To').fill('lead@demo.tallyfit.local');
    await page.getByRole('dialog').getByLabel('Message (optional)').fill('The merged version is ready for a look.');
    await screenshot(page, 'workbench-07-share-1280');
    await page.getByRole('dialog').getByRole('button', { name: 'Send' }).click();
    await page.getByText('The report was sent to lead@demo.tallyfit.local.').waitFor();
    const admin = await DemoApi.signIn(server.url, 'admin');
    const outbox = await admin.expectOk<{ messages: { to: string[]; subject: string; text: string }[] }>('GET', '/outbox');
    const mail = outbox.messages.find((message) => message.to.includes('lead@demo.tallyfit.local'));
    expect(mail?.subject).toContain('Line 3 defects against the usual mix');
    expect(mail?.text).toContain('The merged version is ready for a look.');
  });

  it('plans the next check in the planner', async () => {
    await page.getByRole('link', { name: 'Planner' }).click();
    await page.getByRole('heading', { name: 'Plan a check' }).waitFor();
    // Cohen (1988), Table 7.4.6 (from memory): w = 0.3, df = 3, alpha = .05, power .80 needs about 121 observations.
    const n = Number((await page.getByTestId('planned-n').textContent())?.replace(/,/g, ''));
    expect(n).toBeGreaterThanOrEqual(119);
    expect(n).toBeLessThanOrEqual(123);
    await page.getByRole('heading', { name: 'Power against the number of observations' }).scrollIntoViewIfNeeded();
    await page.getByTestId('power-chart').locator('svg').waitFor();
    await screenshot(page, 'workbench-08-planner-1280');
    expect(await seriousAxeViolations(page)).toEqual([]);
  });

  it('runs an analysis from typed counts by keyboard alone', async () => {
    const keys = await browser.newPage({ viewport: { width: 1280, height: 800 }, reducedMotion: 'reduce' });
    await signInAs(keys, server.url, 'analyst', '/analyses/new');
    await keys.getByRole('heading', { name: 'New analysis' }).waitFor();
    await tabTo(keys, /^Category 1/);
    await keys.keyboard.press('Control+A');
    await keys.keyboard.type('heads');
    await tabTo(keys, /^Observed count/);
    await keys.keyboard.type('61');
    await tabTo(keys, /^Category 2/);
    await keys.keyboard.press('Control+A');
    await keys.keyboard.type('tails');
    await tabTo(keys, /^Observed count/);
    await keys.keyboard.type('39');
    // Wait for each step's header to be selected before tabbing on, so no key press lands mid-change.
    for (const step of ['What was expected', 'Tests and options', 'Run']) {
      await tabTo(keys, /^Next$/);
      await keys.keyboard.press('Enter');
      await keys.getByRole('tab', { name: step, selected: true }).waitFor();
    }
    await tabTo(keys, /^Run the test$/);
    await keys.keyboard.press('Enter');
    // 61 heads in 100 tosses against 1:1: X² = (61 − 50)²/50 · 2 = 4.84, 1 df, p = .028 (arithmetic; chi-square table).
    await keys.getByTestId('statistic').waitFor();
    await expect(keys.getByTestId('statistic').textContent()).resolves.toBe('4.84');
    await expect(keys.getByTestId('p').textContent()).resolves.toBe('= .028');
    await keys.close();
  });

  it('holds its layout on a phone', async () => {
    const phone = await browser.newPage({ viewport: { width: 390, height: 844 }, reducedMotion: 'reduce' });
    await signInAs(phone, server.url, 'analyst', '/analyses/new');
    await phone.getByRole('heading', { name: 'New analysis' }).waitFor();
    await screenshot(phone, 'workbench-01-data-390');
    await phone.goto(analysisUrl);
    await phone.getByText('Some expected counts are too small').waitFor();
    await phone.getByRole('heading', { name: 'Charts' }).scrollIntoViewIfNeeded();
    await phone.getByTestId('shares-chart').locator('svg').waitFor();
    await phone.getByTestId('residuals-chart').scrollIntoViewIfNeeded();
    await phone.getByTestId('residuals-chart').locator('svg').waitFor();
    await phone.getByRole('heading', { name: 'Write-up' }).scrollIntoViewIfNeeded();
    await phone.locator('tf-write-up markdown h2').first().waitFor();
    await screenshot(phone, 'workbench-05-result-390');
    const overflow = await phone.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await phone.goto(`${server.url}/planner`);
    await phone.getByTestId('planned-n').waitFor();
    await phone.getByRole('heading', { name: 'Power against the number of observations' }).scrollIntoViewIfNeeded();
    await phone.getByTestId('power-chart').locator('svg').waitFor();
    await screenshot(phone, 'workbench-08-planner-390');
    await phone.close();
  });
});
