import { createHmac, timingSafeEqual } from 'node:crypto';
import { createServer, type IncomingHttpHeaders, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { seriousAxeViolations } from './support/axe-check';
import { launchBrowser, screenshot } from './support/browser';
import { signInAs } from './support/console-sign-in';
import { DemoApi } from './support/demo-api';
import { focusedName, tabTo } from './support/keyboard';
import { settle } from './support/settle';
import { startTallyfit, type RunningServer } from './support/tallyfit-server';

const WATCH_NAME = 'Checkout redesign: does traffic still split 50/50?';
const WEBHOOK_SECRET = 'e2e-webhook-secret-for-signing';
const BATCHES = 30;
const BATCH_SIZE = 20_000;
/** The last ten batches lean 51/49: a 2-point imbalance in the split the experiment was configured with. */
const DRIFTING_FROM = 21;

/** Counts of one batch: balanced (with a little alternating noise) until the drift starts, then 51/49. */
function batchCounts(sequence: number): { control: number; redesign: number } {
  if (sequence >= DRIFTING_FROM) return { control: 0.51 * BATCH_SIZE, redesign: 0.49 * BATCH_SIZE };
  const wobble = sequence % 2 === 0 ? 40 : -40;
  return { control: BATCH_SIZE / 2 + wobble, redesign: BATCH_SIZE / 2 - wobble };
}

interface ReceivedCall {
  headers: IncomingHttpHeaders;
  body: Buffer;
}

/** A local webhook receiver: keeps every call's headers and raw body, answers 204. */
async function startReceiver(calls: ReceivedCall[]): Promise<{ server: Server; url: string }> {
  const server = createServer((request, response) => {
    const chunks: Buffer[] = [];
    request.on('data', (chunk: Buffer) => chunks.push(chunk));
    request.on('end', () => {
      calls.push({ headers: request.headers, body: Buffer.concat(chunks) });
      response.writeHead(204).end();
    });
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  return { server, url: `http://127.0.0.1:${(server.address() as AddressInfo).port}/tallyfit-alerts` };
}

/** Asks again until `probe` gives a value, failing with `what` after the time is up. */
async function eventually<T>(what: string, probe: () => Promise<T | null | undefined>, timeoutMs = 30_000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await probe();
    if (value !== null && value !== undefined) return value;
    if (Date.now() > deadline) throw new Error(`${what} did not happen within ${timeoutMs / 1000} s`);
    await new Promise((resolve) => setTimeout(resolve, 500));
  }
}

describe('an analyst sets up a watch, a pipeline feeds it, it raises an alarm and a lead acknowledges it', () => {
  let server: RunningServer;
  let browser: Browser;
  let analystContext: BrowserContext;
  let page: Page;
  let receiver: { server: Server; url: string };
  const calls: ReceivedCall[] = [];
  let watchId: number;

  beforeAll(async () => {
    [server, browser, receiver] = await Promise.all([startTallyfit(), launchBrowser(), startReceiver(calls)]);
    // axe-core is added to the page as a script, which the console's content security policy would refuse.
    analystContext = await browser.newContext({ viewport: { width: 1280, height: 800 }, bypassCSP: true });
    page = await analystContext.newPage();
  });

  afterAll(async () => {
    await browser?.close();
    await server?.stop();
    await new Promise((resolve) => receiver?.server.close(resolve));
  });

  it('lets the analyst set up a watch on the demo experiment through the console', async () => {
    await signInAs(page, server.url, 'analyst', '/watches');
    await page.getByRole('heading', { name: 'Watches', exact: true }).waitFor();
    await page.getByRole('link', { name: 'New watch' }).click();
    await page.getByRole('heading', { name: 'New watch' }).waitFor();

    await page.getByRole('combobox', { name: 'Study' }).click();
    await page.getByRole('option', { name: 'Bramblewick Goods storefront checks' }).click();
    await page.getByLabel('Name').fill(WATCH_NAME);
    await page.getByLabel('Categories').fill('control\nredesign');
    // Every category equally likely is the first choice; the preview shows the shares it implies.
    await page.getByRole('radio', { name: 'Every category equally likely' }).check();
    await page.getByTestId('expected-preview').getByText('0.5000').first().waitFor();
    await page.getByRole('radio', { name: /Sent by a pipeline/ }).check();
    await page.getByLabel('Webhook address (optional)').fill(receiver.url);
    await page.getByLabel('Webhook secret').fill(WEBHOOK_SECRET);
    await settle(page);
    await screenshot(page, 'watch-form-1280');
    await page.getByRole('button', { name: 'Start watching' }).click();

    await page.waitForURL(/\/watches\/\d+$/);
    watchId = Number(new URL(page.url()).pathname.split('/').pop());
    await page.getByRole('heading', { name: WATCH_NAME }).waitFor();
    await expect(page.getByTestId('watch-state').textContent()).resolves.toContain('Holding');
    await expect(page.getByTestId('push-example').textContent()).resolves.toContain(`/api/v1/watches/${watchId}/batches`);
  });

  it('takes 30 batches from a pipeline with an API token, counting a retried batch once', async () => {
    const analyst = await DemoApi.signIn(server.url, 'analyst');
    const { token } = await analyst.expectOk<{ token: string }>('POST', '/tokens', { name: 'checkout split pipeline' });
    const push = async (sequence: number) => {
      const start = new Date(Date.UTC(2026, 11, 1, 0) + (sequence - 1) * 3_600_000);
      const response = await fetch(`${server.url}/api/v1/watches/${watchId}/batches`, {
        method: 'POST',
        headers: { Authorization: `Bearer ${token}`, 'Content-Type': 'application/json' },
        body: JSON.stringify({
          idempotencyKey: `hour-${sequence}`,
          periodStart: start.toISOString(),
          periodEnd: new Date(start.getTime() + 3_600_000).toISOString(),
          counts: batchCounts(sequence),
        }),
      });
      const body = (await response.json()) as { created: boolean; watch: { state: string; sequentialP: number } };
      if (!response.ok) throw new Error(`batch ${sequence} answered ${response.status}: ${JSON.stringify(body)}`);
      return body;
    };
    const states: string[] = [];
    for (let sequence = 1; sequence <= BATCHES; sequence++) states.push((await push(sequence)).watch.state);
    // Balanced batches hold; the 51/49 batches tip the sequential test over alpha before the end.
    expect(states.slice(0, DRIFTING_FROM - 1).every((state) => state === 'holding')).toBe(true);
    expect(states.at(-1)).toBe('alarm');
    const retried = await push(BATCHES);
    expect(retried.created).toBe(false);
    const watch = await analyst.expectOk<{ batchCount: number; n: number }>('GET', `/watches/${watchId}`);
    expect(watch).toMatchObject({ batchCount: BATCHES, n: BATCHES * BATCH_SIZE });
  });

  it('turns to alarm on the watch page without a reload', async () => {
    await page.getByTestId('watch-state').getByText('Alarm raised').waitFor({ timeout: 30_000 });
    await expect(page.getByTestId('alert-state').textContent()).resolves.toBe('Waiting for a lead');
    await page.getByTestId('p-timeline').locator('svg').waitFor();
    await page.getByTestId('shares-timeline').locator('svg').waitFor();
    await settle(page);
    await screenshot(page, 'watch-alarm-1280');
    await expect(seriousAxeViolations(page)).resolves.toEqual([]);
    await page.setViewportSize({ width: 390, height: 844 });
    // The charts redraw for the narrow screen a moment after it changes; nothing may stick out sideways.
    await page.waitForFunction(() => document.documentElement.scrollWidth <= window.innerWidth, undefined, { timeout: 10_000 });
    await settle(page);
    await screenshot(page, 'watch-alarm-390');

    await page.goto(`${server.url}/watches`);
    const row = page.locator('tbody tr', { hasText: WATCH_NAME });
    await row.getByText('Alarm raised').waitFor();
    await expect(row.textContent()).resolves.toContain('Waiting for a lead');
    await page.waitForFunction(() => document.documentElement.scrollWidth <= window.innerWidth, undefined, { timeout: 10_000 });
    await settle(page);
    await screenshot(page, 'watches-390');
    await page.setViewportSize({ width: 1280, height: 800 });
    await settle(page);
    await screenshot(page, 'watches-1280');
    await expect(seriousAxeViolations(page)).resolves.toEqual([]);
    // Two pages, two screen sizes and two accessibility checks on a shared machine: more time than one step.
  }, 120_000);

  it('e-mails the alarm through the local mail stand-in, where an admin reads it', async () => {
    const admin = await DemoApi.signIn(server.url, 'admin');
    const mail = await eventually('the alarm e-mail', async () => {
      const outbox = await admin.expectOk<{ messages: { to: string[]; subject: string; text: string }[] }>('GET', '/outbox');
      return outbox.messages.find((message) => message.subject.includes(WATCH_NAME));
    });
    expect(mail.to).toContain('analyst@demo.tallyfit.local');
    expect(mail.text).toContain(`/watches/${watchId}`);
  });

  it('posts the alarm to the webhook with a signature the receiver verifies', async () => {
    const call = await eventually('the webhook call', async () => calls[0]);
    const signature = call.headers['x-tallyfit-signature'];
    expect(typeof signature).toBe('string');
    const expected = Buffer.from(`sha256=${createHmac('sha256', WEBHOOK_SECRET).update(call.body).digest('hex')}`);
    expect(timingSafeEqual(Buffer.from(signature as string), expected)).toBe(true);
    const payload = JSON.parse(call.body.toString('utf8')) as { event: string; watch: { id: number }; sequentialP: number; alpha: number };
    expect(payload).toMatchObject({ event: 'watch.alarm', watch: { id: watchId }, alpha: 0.05 });
    expect(payload.sequentialP).toBeLessThan(0.05);
    // Only the change of state is sent, not every batch after it.
    expect(calls).toHaveLength(1);
  });

  it('lets a lead acknowledge the alarm on the watch page, by keyboard, with a note', async () => {
    const leadContext = await browser.newContext({ viewport: { width: 1280, height: 800 } });
    const lead = await leadContext.newPage();
    await signInAs(lead, server.url, 'lead', `/watches/${watchId}`);
    await lead.getByRole('heading', { name: WATCH_NAME }).waitFor();
    await lead.getByRole('heading', { name: 'Alerts' }).waitFor();
    await lead.getByText(/E-mail to analyst@demo\.tallyfit\.local: delivered/).waitFor({ timeout: 30_000 });
    await lead.getByText(/Webhook to http:\/\/127\.0\.0\.1:\d+\/tallyfit-alerts: delivered/).waitFor();

    await tabTo(lead, /^Acknowledge the alarm$/);
    await lead.keyboard.press('Enter');
    const dialog = lead.getByRole('dialog');
    await dialog.getByRole('heading', { name: /Acknowledge the alarm/ }).waitFor();
    // The dialog puts the focus on the note once it has opened.
    await eventually('the focus on the note', async () => ((await focusedName(lead)) === 'Note' ? true : null), 5_000);
    await lead.keyboard.type('Load balancer weights were changed on Tuesday; reverted.');
    await tabTo(lead, /^Acknowledge$/, 5);
    await lead.keyboard.press('Enter');
    await lead.getByTestId('alert-state').getByText('Acknowledged').waitFor();
    await lead.getByText(/Acknowledged by Lee Lead/).waitFor();

    const api = await DemoApi.signIn(server.url, 'lead');
    const alerts = await api.expectOk<{ items: { kind: string; acknowledgedBy: { name: string } | null; note: string | null }[] }>(
      'GET',
      `/watches/${watchId}/alerts`,
    );
    expect(alerts.items[0]).toMatchObject({
      kind: 'alarm',
      acknowledgedBy: { name: 'Lee Lead' },
      note: 'Load balancer weights were changed on Tuesday; reverted.',
    });
    await leadContext.close();
  });
});
