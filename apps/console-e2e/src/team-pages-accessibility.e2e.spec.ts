import type { Browser, BrowserContext, Page } from 'playwright-core';
import { seriousAxeViolations } from './support/axe-check';
import { launchBrowser, screenshot } from './support/browser';
import { settle } from './support/settle';
import { signInAs } from './support/console-sign-in';
import { DemoApi } from './support/demo-api';
import { focusedName, tabTo } from './support/keyboard';
import { DEMO_PASSWORD, startTallyfit, type RunningServer } from './support/tallyfit-server';

const VIEWPORTS = [
  { name: '1280', width: 1280, height: 800 },
  { name: '390', width: 390, height: 844 },
] as const;

interface PageUnderTest {
  name: string;
  path: (ids: { studyId: number; analysisId: number }) => string;
  /** Something that is only there once the page has its data. */
  ready: (page: Page) => Promise<unknown>;
}

const PAGES: PageUnderTest[] = [
  { name: 'studies', path: () => '/studies', ready: (page) => page.locator('table tbody tr a').first().waitFor() },
  { name: 'study', path: ({ studyId }) => `/studies/${studyId}`, ready: (page) => page.locator('tf-analyses-table table tbody tr').first().waitFor() },
  { name: 'history', path: () => '/history', ready: (page) => page.locator('table tbody tr').first().waitFor() },
  { name: 'result', path: ({ analysisId }) => `/analyses/${analysisId}`, ready: (page) => page.locator('main h1').first().waitFor() },
  { name: 'new-analysis', path: ({ studyId }) => `/analyses/new?study=${studyId}`, ready: (page) => page.locator('main h1').first().waitFor() },
  { name: 'planner', path: () => '/planner', ready: (page) => page.locator('main h1').first().waitFor() },
  { name: 'tokens', path: () => '/tokens', ready: (page) => page.getByRole('cell', { name: 'nightly traffic-split check', exact: true }).waitFor() },
  { name: 'admin-people', path: () => '/admin/people', ready: (page) => page.locator('main').getByText('Ada Admin').first().waitFor() },
  { name: 'admin-audit', path: () => '/admin/audit', ready: (page) => page.locator('table.events tbody tr').first().waitFor() },
  { name: 'admin-outbox', path: () => '/admin/outbox', ready: (page) => page.locator('mat-expansion-panel').first().waitFor() },
];

/** True when nothing is wider than the window: wide tables must scroll inside their own box. */
async function pageFitsWidth(page: Page): Promise<boolean> {
  return page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth + 1);
}

describe('the team pages pass an accessibility check and hold their layout', () => {
  let server: RunningServer;
  let browser: Browser;
  const ids = { studyId: 0, analysisId: 0 };

  beforeAll(async () => {
    [server, browser] = await Promise.all([startTallyfit(), launchBrowser()]);
    const analyst = await DemoApi.signIn(server.url, 'analyst');
    [{ id: ids.studyId }] = await analyst.expectOk<{ id: number }[]>('GET', '/studies');
    const analyses = await analyst.expectOk<{ items: { id: number }[] }>('GET', `/analyses?studyId=${ids.studyId}&q=weekday`);
    ids.analysisId = analyses.items[0].id;
    await analyst.expectOk('POST', `/analyses/${ids.analysisId}/submit`, {});
    await analyst.expectOk('POST', `/analyses/${ids.analysisId}/comments`, { body: 'Counts are from the week of 16 November.' });
    // Something in the outbox and in the token list, so those pages are checked with content.
    await analyst.expectOk('POST', `/analyses/${ids.analysisId}/shares`, { to: ['pat@example.org'], message: 'For Monday.' });
    const admin = await DemoApi.signIn(server.url, 'admin');
    await admin.expectOk('POST', '/tokens', { name: 'nightly traffic-split check' });
  });

  afterAll(async () => {
    await browser?.close();
    await server?.stop();
  });

  describe.each(VIEWPORTS)('at $width × $height', (viewport) => {
    let context: BrowserContext;
    let page: Page;

    beforeAll(async () => {
      // axe-core is injected as a script, which the console's own CSP (rightly) forbids: let the test through.
      context = await browser.newContext({ viewport: { width: viewport.width, height: viewport.height }, bypassCSP: true });
      page = await context.newPage();
      page.setDefaultTimeout(10_000);
    });

    afterAll(() => context?.close());

    it('sign-in', async () => {
      await page.goto(`${server.url}/sign-in`);
      await page.getByRole('heading', { name: 'Sign in to Tallyfit' }).waitFor();
      await settle(page);
      await screenshot(page, `a11y-sign-in-${viewport.name}`);
      await expect(seriousAxeViolations(page)).resolves.toEqual([]);
      await expect(pageFitsWidth(page)).resolves.toBe(true);
      await signInAs(page, server.url, 'admin', '/studies');
    });

    it.each(PAGES)('$name', async ({ name, path, ready }) => {
      await page.goto(`${server.url}${path(ids)}`);
      await ready(page);
      await page.waitForLoadState('networkidle');
      await settle(page);
      await screenshot(page, `a11y-${name}-${viewport.name}`);
      await expect(seriousAxeViolations(page)).resolves.toEqual([]);
      await expect(pageFitsWidth(page)).resolves.toBe(true);
    });

    it('review dialog', async () => {
      await page.goto(`${server.url}/history?status=in_review`);
      await page.locator('table tbody tr').first().waitFor();
      await page.locator('table tbody button').first().click();
      await page.getByRole('dialog').getByText('Counts are from the week of 16 November.').waitFor();
      await settle(page);
      await screenshot(page, `a11y-review-dialog-${viewport.name}`);
      await expect(seriousAxeViolations(page)).resolves.toEqual([]);
      await page.keyboard.press('Escape');
    });

    it('study members and the add-member dialog', async () => {
      await page.goto(`${server.url}/studies/${ids.studyId}`);
      await page.getByRole('tab', { name: /Members/ }).click();
      await page.locator('main').getByText('Vic Viewer', { exact: true }).waitFor();
      await settle(page);
      await screenshot(page, `a11y-study-members-${viewport.name}`);
      await expect(seriousAxeViolations(page)).resolves.toEqual([]);
      await expect(pageFitsWidth(page)).resolves.toBe(true);
      await page.getByRole('button', { name: 'Add a member' }).click();
      await page.getByRole('dialog').getByRole('heading', { name: 'Add a member' }).waitFor();
      await settle(page);
      await screenshot(page, `a11y-add-member-${viewport.name}`);
      await expect(seriousAxeViolations(page)).resolves.toEqual([]);
      await page.keyboard.press('Escape');
    });

    it('new study dialog', async () => {
      await page.goto(`${server.url}/studies`);
      await page.getByRole('button', { name: 'New study' }).click();
      await page.getByRole('dialog').getByLabel('Name').waitFor();
      await settle(page);
      await screenshot(page, `a11y-new-study-${viewport.name}`);
      await expect(seriousAxeViolations(page)).resolves.toEqual([]);
      await page.keyboard.press('Escape');
    });

    it('add person dialog', async () => {
      await page.goto(`${server.url}/admin/people`);
      await page.getByRole('button', { name: 'Add a person' }).click();
      await page.getByRole('dialog').getByLabel('First password').waitFor();
      await settle(page);
      await screenshot(page, `a11y-add-person-${viewport.name}`);
      await expect(seriousAxeViolations(page)).resolves.toEqual([]);
      await page.keyboard.press('Escape');
    });

    it('places menu', async () => {
      await page.goto(`${server.url}/studies`);
      await page.locator('table tbody tr a').first().waitFor();
      const trigger = viewport.width < 960 ? page.getByRole('button', { name: 'Open the list of places' }) : page.getByRole('button', { name: /^Admin/ });
      await trigger.click();
      await page.getByRole('menuitem', { name: /Audit trail/ }).waitFor();
      await settle(page);
      await screenshot(page, `a11y-menu-${viewport.name}`);
      await expect(seriousAxeViolations(page)).resolves.toEqual([]);
      await page.keyboard.press('Escape');
    });
  });

  it('folds the history’s detailed filters away on a phone and unfolds them on request', async () => {
    const context = await browser.newContext({ viewport: { width: 390, height: 844 }, bypassCSP: true });
    const page = await context.newPage();
    try {
      await signInAs(page, server.url, 'lead', '/history');
      await page.locator('table tbody tr').first().waitFor();
      await expect(page.getByLabel('Run by').isVisible()).resolves.toBe(false);
      await page.getByRole('button', { name: 'More filters' }).click();
      await page.getByLabel('Run by').waitFor();
      await settle(page);
      await screenshot(page, 'a11y-history-filters-open-390');
      await expect(seriousAxeViolations(page)).resolves.toEqual([]);
      await expect(pageFitsWidth(page)).resolves.toBe(true);
      // Column headers are not shown on a phone; the order is chosen from a list instead.
      await page.getByLabel('Order').click();
      await page.getByRole('option', { name: 'Smallest p first' }).click();
      await page.waitForURL(/sort=p&order=asc/);
    } finally {
      await context.close();
    }
  });

  describe('by keyboard alone', () => {
    let context: BrowserContext;
    let page: Page;

    beforeAll(async () => {
      context = await browser.newContext({ viewport: { width: 1280, height: 800 } });
      page = await context.newPage();
      page.setDefaultTimeout(10_000);
    });

    afterAll(() => context?.close());

    it('signs in', async () => {
      await page.goto(`${server.url}/sign-in?returnUrl=%2Fhistory`);
      await page.getByRole('heading', { name: 'Sign in to Tallyfit' }).waitFor();
      await tabTo(page, /^E-mail/);
      await page.keyboard.type('lead@demo.tallyfit.local');
      await page.keyboard.press('Tab');
      await expect(focusedName(page)).resolves.toMatch(/^Password/);
      await page.keyboard.type(DEMO_PASSWORD);
      await page.keyboard.press('Tab');
      await expect(focusedName(page)).resolves.toBe('Sign in');
      await page.keyboard.press('Enter');
      await page.waitForURL((url) => url.pathname === '/history');
    });

    it('filters the history, opens an analysis’s review and closes it again', async () => {
      await page.locator('table tbody tr').first().waitFor();
      await tabTo(page, /^Skip to content$/);
      await page.keyboard.press('Enter');
      await tabTo(page, /^Search titles and notes/);
      await page.keyboard.type('weekday');
      await page.waitForURL(/q=weekday/);
      await page.getByText('1 analysis', { exact: true }).waitFor();

      await tabTo(page, /^Only those waiting for review$/);
      await page.keyboard.press('Enter');
      await page.waitForURL(/status=in_review/);

      await tabTo(page, /^Study/);
      await page.keyboard.press('Enter');
      await page.getByRole('listbox').waitFor();
      await page.keyboard.press('ArrowDown');
      await page.keyboard.press('Enter');
      await page.waitForURL(/studyId=/);

      const review = await tabTo(page, /^Review /);
      await page.keyboard.press('Enter');
      const dialog = page.getByRole('dialog');
      await dialog.getByRole('button', { name: 'Sign off' }).waitFor();
      await settle(page);
      await screenshot(page, 'keyboard-review-dialog-1280');
      await page.keyboard.press('Escape');
      await dialog.waitFor({ state: 'detached' });
      // Focus goes back to the button that opened the dialog.
      await expect(focusedName(page)).resolves.toBe(review);
    });
  });
});
