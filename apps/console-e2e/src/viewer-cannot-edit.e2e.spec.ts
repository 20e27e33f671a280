import type { Browser, Page } from 'playwright-core';
import { launchBrowser } from './support/browser';
import { signInAs } from './support/console-sign-in';
import { DemoApi } from './support/demo-api';
import { startTallyfit, type RunningServer } from './support/tallyfit-server';

/** Words on any control that would change something; a viewer must see none of them. */
const CHANGING = /\b(new study|new analysis|archive|restore|rename|add a member|remove|review|sign off|return for changes|re-?run|submit|delete|upload|share)\b/i;

describe('a viewer can read but not change anything', () => {
  let server: RunningServer;
  let browser: Browser;
  let page: Page;
  let studyId: number;
  let analysisId: number;

  beforeAll(async () => {
    [server, browser] = await Promise.all([startTallyfit(), launchBrowser()]);
    const analyst = await DemoApi.signIn(server.url, 'analyst');
    [{ id: studyId }] = await analyst.expectOk<{ id: number }[]>('GET', '/studies');
    const page1 = await analyst.expectOk<{ items: { id: number }[] }>('GET', `/analyses?studyId=${studyId}`);
    analysisId = page1.items[0].id;
    await analyst.expectOk('POST', `/analyses/${analysisId}/submit`, {});
    page = await browser.newPage({ viewport: { width: 1280, height: 800 } });
    await signInAs(page, server.url, 'viewer', '/studies');
  });

  afterAll(async () => {
    await browser?.close();
    await server?.stop();
  });

  async function changingControls(): Promise<string[]> {
    const names = await page
      .locator('main button, main a[mat-button], main a[mat-flat-button], main a[mat-stroked-button], mat-toolbar a, mat-toolbar button')
      .evaluateAll((elements) => elements.map((el) => (el.getAttribute('aria-label') ?? el.textContent ?? '').trim()));
    return names.filter((name) => CHANGING.test(name));
  }

  it('sees the studies it reads, with nothing to create or archive', async () => {
    await page.locator('table tbody tr a').first().waitFor();
    await expect(changingControls()).resolves.toEqual([]);
  });

  it('sees a study’s analyses and members, with nothing to run, rename or manage', async () => {
    await page.goto(`${server.url}/studies/${studyId}`);
    await page.getByRole('tab', { name: /Members/ }).click();
    await page.locator('main').getByText('Vic Viewer', { exact: true }).waitFor();
    await expect(page.locator('main mat-select').count()).resolves.toBe(0);
    await expect(changingControls()).resolves.toEqual([]);
  });

  it('sees the history without review actions, even on an analysis waiting for review', async () => {
    await page.goto(`${server.url}/history?status=in_review`);
    await page.locator('table tbody tr').first().waitFor();
    const labels = await page.locator('table tbody button').evaluateAll((els) => els.map((el) => el.getAttribute('aria-label') ?? ''));
    expect(labels.length).toBeGreaterThan(0);
    expect(labels.every((label) => label.startsWith('Comments on'))).toBe(true);
    await expect(changingControls()).resolves.toEqual([]);
    await page.locator('table tbody button').first().click();
    const dialog = page.getByRole('dialog');
    await dialog.getByRole('heading', { name: 'Comments and review' }).waitFor();
    await expect(dialog.getByRole('button', { name: /Sign off|Return for changes/ }).count()).resolves.toBe(0);
    await page.keyboard.press('Escape');
  });

  it('reads a result without controls that change it', async () => {
    await page.goto(`${server.url}/analyses/${analysisId}`);
    await page.locator('main h1').first().waitFor();
    await expect(changingControls()).resolves.toEqual([]);
  });

  it('is refused by the API when it tries a change directly', async () => {
    const viewer = await DemoApi.signIn(server.url, 'viewer');
    const attempts = await Promise.all([
      viewer.call('POST', '/studies', { name: 'Not allowed' }),
      viewer.call('PATCH', `/studies/${studyId}`, { archived: true }),
      viewer.call('POST', '/analyses', {
        title: 'Not allowed',
        studyId,
        spec: { observed: { labels: ['a', 'b'], counts: [1, 2] }, hypothesis: { kind: 'equal' } },
      }),
      viewer.call('POST', `/analyses/${analysisId}/sign-off`, {}),
      viewer.call('POST', `/analyses/${analysisId}/return`, { comment: 'no' }),
      viewer.call('GET', '/people'),
    ]);
    expect(attempts.map((attempt) => attempt.status)).toEqual([403, 403, 403, 403, 403, 403]);
    const lead = await DemoApi.signIn(server.url, 'lead');
    await expect(lead.expectOk<{ status: string }>('GET', `/analyses/${analysisId}`)).resolves.toMatchObject({ status: 'in_review' });
  });
});
