import { createServer, type IncomingHttpHeaders, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { WEBHOOK_SIGNATURE_HEADER, type WebhookPayload } from '@tallyfit/contracts';
import { createTestApp, rowCounts, type TestContext } from '../../testing/test-app';
import { refuseAuditWrites } from '../../testing/refuse-audit-writes';
import { verifyWebhookSignature } from './webhook-signature';

const WEBHOOK_SECRET = 'receiver secret, 32 characters!!';

/** A local webhook receiver: answers 503 to the first `failFirst` posts, 204 after; keeps what it got. */
async function startReceiver(failFirst: number) {
  const received: Array<{ headers: IncomingHttpHeaders; body: string; answered: number }> = [];
  const server: Server = createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on('data', (chunk: Buffer) => chunks.push(chunk));
    req.on('end', () => {
      const answered = received.length < failFirst ? 503 : 204;
      received.push({ headers: req.headers, body: Buffer.concat(chunks).toString('utf8'), answered });
      res.writeHead(answered).end();
    });
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  return {
    url: `http://127.0.0.1:${(server.address() as AddressInfo).port}/tallyfit-alerts`,
    received,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

async function eventually<T>(read: () => Promise<T>, done: (value: T) => boolean, timeoutMs = 10_000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  let value = await read();
  while (!done(value) && Date.now() < deadline) {
    await new Promise((resolve) => setTimeout(resolve, 100));
    value = await read();
  }
  return value;
}

describe('watches', () => {
  let ctx: TestContext;
  let studyId: number;
  let receiver: Awaited<ReturnType<typeof startReceiver>>;

  beforeAll(async () => {
    ctx = await createTestApp({ watchOptions: { delivery: { firstRetryMs: 200, pollMs: 100 } } });
    receiver = await startReceiver(1);
    studyId = (await ctx.as('analyst').post('/studies', { name: 'Checkout button colour trial' }).expect(201)).body.id;
  }, 60_000);
  afterAll(async () => {
    await ctx?.close();
    await receiver?.close();
  });

  const newWatch = async (overrides: object = {}) =>
    (
      await ctx
        .as('analyst')
        .post('/watches', {
          studyId,
          name: 'Blue or green button',
          labels: ['blue', 'green'],
          hypothesis: { kind: 'equal' },
          feed: { kind: 'push' },
          ...overrides,
        })
        .expect(201)
    ).body;

  let period = 0;
  /** A batch for the next hour of a made-up day. */
  const batch = (counts: Record<string, number>, key = `hour-${++period}`) => ({
    idempotencyKey: key,
    periodStart: new Date(Date.UTC(2026, 2, 1, period)).toISOString(),
    periodEnd: new Date(Date.UTC(2026, 2, 1, period + 1)).toISOString(),
    counts,
  });

  it('lets analysts create watches in their studies; leads and viewers read them', async () => {
    const watch = await newWatch({ webhook: { url: receiver.url, secret: WEBHOOK_SECRET } });
    expect(watch).toMatchObject({
      study: { id: studyId, name: 'Checkout button colour trial' },
      state: 'holding',
      alarm: false,
      alertState: 'none',
      sequentialP: 1,
      n: 0,
      alpha: 0.05,
      webhook: { url: receiver.url, hasSecret: true, signatureHeader: WEBHOOK_SIGNATURE_HEADER },
    });
    expect(JSON.stringify(watch)).not.toContain(WEBHOOK_SECRET);
    expect((await ctx.as('lead').get(`/watches/${watch.id}`)).status).toBe(200);
    expect((await ctx.as('viewer').get(`/watches/${watch.id}`)).status).toBe(404);
    const attempt = { studyId, name: 'x', labels: ['a', 'b'], hypothesis: { kind: 'equal' }, feed: { kind: 'push' } };
    expect((await ctx.as('lead').post('/watches', attempt)).status).toBe(403);
    expect((await ctx.as('viewer').post('/watches', attempt)).status).toBe(403);
    const listed = await ctx.as('lead').get(`/watches?studyId=${studyId}&state=holding`).expect(200);
    expect(listed.body.items.map((item: { id: number }) => item.id)).toContain(watch.id);
  });

  it('takes a pushed batch with an API token, once per idempotency key', async () => {
    const watch = await newWatch();
    const token = (await ctx.as('analyst').post('/tokens', { name: 'nightly pipeline' }).expect(201)).body.token as string;
    expect(token).toMatch(/^tf_/);
    const body = batch({ blue: 510, green: 490 });
    const first = await ctx.as(token).post(`/watches/${watch.id}/batches`, body).expect(201);
    expect(first.body).toMatchObject({ created: true, batch: { sequence: 1, n: 1000, cumulativeN: 1000, source: 'push', counts: { blue: 510, green: 490 } } });
    expect(first.body.watch).toMatchObject({ n: 1000, batchCount: 1 });
    const analysis = await ctx.as('analyst').get(`/analyses/${first.body.batch.analysisId}`).expect(200);
    expect(analysis.body).toMatchObject({ study: { id: studyId }, spec: { observed: { labels: ['blue', 'green'], counts: [510, 490] } } });

    const retried = await ctx.as(token).post(`/watches/${watch.id}/batches`, body).expect(200);
    expect(retried.body).toMatchObject({ created: false, batch: { id: first.body.batch.id }, watch: { n: 1000, batchCount: 1 } });
    const batches = await ctx.as('viewer').get(`/watches/${watch.id}/batches`);
    expect(batches.status).toBe(404); // the viewer is not a member of this study
    expect((await ctx.as('lead').get(`/watches/${watch.id}/batches`).expect(200)).body.total).toBe(1);
  });

  it('refuses unknown and missing categories by name, storing nothing', async () => {
    const watch = await newWatch();
    const before = await rowCounts(ctx.db, ['watch_batches', 'analyses', 'audit_events']);
    const response = await ctx.as('analyst').post(`/watches/${watch.id}/batches`, batch({ blue: 10, teal: 3 }));
    expect(response.status).toBe(422);
    expect(response.body.error.message).toContain('categories this watch does not have: "teal"');
    expect(response.body.error.message).toContain('no count for "green"');
    expect(response.body.error.fields).toEqual([
      { path: 'counts.teal', message: 'not a category of this watch' },
      { path: 'counts.green', message: 'missing: send 0 when none were seen' },
    ]);
    const negative = await ctx.as('analyst').post(`/watches/${watch.id}/batches`, batch({ blue: -1, green: 3 }));
    expect(negative.status).toBe(400);
    expect(await rowCounts(ctx.db, ['watch_batches', 'analyses', 'audit_events'])).toEqual(before);
  });

  it('stores a batch, its analysis and the watch change together or not at all', async () => {
    const watch = await newWatch();
    const before = await rowCounts(ctx.db, ['watch_batches', 'analyses', 'audit_events']);
    const allowAuditWrites = await refuseAuditWrites(ctx.db, "new.entity_type = 'watch-batch'");
    try {
      const response = await ctx.as('analyst').post(`/watches/${watch.id}/batches`, batch({ blue: 5, green: 5 }));
      expect(response.status).toBe(500);
    } finally {
      await allowAuditWrites();
    }
    expect(await rowCounts(ctx.db, ['watch_batches', 'analyses', 'audit_events'])).toEqual(before);
    expect((await ctx.as('analyst').get(`/watches/${watch.id}`)).body).toMatchObject({ n: 0, batchCount: 0 });
  });

  it('alarms once on an imbalance, by e-mail and a signed webhook (retried), and a lead acknowledges it', async () => {
    const watch = await newWatch({ name: 'Split that drifts', webhook: { url: receiver.url, secret: WEBHOOK_SECRET } });
    // Ten balanced hours, then 56% / 44% until the sequential test alarms (common practice, no
    // source: a 12-point gap over thousands of visitors is far beyond chance at α = 0.05).
    for (let hour = 0; hour < 10; hour++) await ctx.as('analyst').post(`/watches/${watch.id}/batches`, batch({ blue: 500, green: 500 })).expect(201);
    let state = 'holding';
    let pushed = 0;
    while (state !== 'alarm' && pushed < 20) {
      state = (await ctx.as('analyst').post(`/watches/${watch.id}/batches`, batch({ blue: 560, green: 440 })).expect(201)).body.watch.state;
      pushed++;
    }
    expect(state).toBe('alarm');
    // Still in alarm after more batches: one alert, not one per batch.
    await ctx.as('analyst').post(`/watches/${watch.id}/batches`, batch({ blue: 560, green: 440 })).expect(201);
    const alerts = (await ctx.as('lead').get(`/watches/${watch.id}/alerts`).expect(200)).body;
    expect(alerts.total).toBe(1);
    const [alert] = alerts.items;
    expect(alert).toMatchObject({ kind: 'alarm', acknowledgedAt: null });
    expect(alert.sequentialP).toBeLessThan(0.05);

    // The e-mail reaches the local stand-in; the webhook is retried after the receiver's 503.
    const outbox = await eventually(
      async () => ctx.mail.outbox() ?? [],
      (mails) => mails.some((mail) => mail.subject === 'Tallyfit: "Split that drifts" is in alarm'),
    );
    const mail = outbox.find((message) => message.subject === 'Tallyfit: "Split that drifts" is in alarm')!;
    expect(mail.to).toEqual(['analyst@test.local']);
    expect(mail.text).toContain(`/watches/${watch.id}`);
    const delivered = await eventually(
      async () => (await ctx.as('lead').get(`/watches/${watch.id}/alerts`)).body.items[0].deliveries,
      (deliveries: Array<{ status: string }>) => deliveries.every((delivery) => delivery.status !== 'pending'),
    );
    expect(delivered).toEqual([
      expect.objectContaining({ channel: 'email', target: 'analyst@test.local', status: 'delivered', attempts: 1 }),
      expect.objectContaining({ channel: 'webhook', target: receiver.url, status: 'delivered', attempts: 2, lastError: 'the receiver answered HTTP 503' }),
    ]);
    const posts = receiver.received.filter((post) => (JSON.parse(post.body) as WebhookPayload).watch.id === watch.id);
    expect(posts.map((post) => post.answered)).toEqual([503, 204]);
    for (const post of posts) {
      expect(verifyWebhookSignature(WEBHOOK_SECRET, post.body, post.headers[WEBHOOK_SIGNATURE_HEADER.toLowerCase()] as string)).toBe(true);
    }
    expect(posts[0].body).toBe(posts[1].body);
    expect(JSON.parse(posts[1].body)).toMatchObject({ event: 'watch.alarm', alertId: alert.id, alpha: 0.05, watch: { id: watch.id } });

    // Only leads and admins acknowledge, once.
    expect((await ctx.as('analyst').post(`/alerts/${alert.id}/acknowledge`, { note: 'mine' })).status).toBe(403);
    const acknowledged = await ctx.as('lead').post(`/alerts/${alert.id}/acknowledge`, { note: 'Assignment cache found; fixing.' }).expect(200);
    expect(acknowledged.body).toMatchObject({ acknowledgedBy: { id: ctx.userIds.lead }, note: 'Assignment cache found; fixing.' });
    expect((await ctx.as('lead').post(`/alerts/${alert.id}/acknowledge`, {})).status).toBe(409);
    expect((await ctx.as('lead').get(`/watches/${watch.id}`)).body).toMatchObject({ state: 'alarm', alertState: 'acknowledged' });

    // A lead pauses it; a paused watch takes no batches; resuming with a restart clears the alarm.
    await ctx.as('lead').post(`/watches/${watch.id}/pause`).expect(200);
    const refused = await ctx.as('analyst').post(`/watches/${watch.id}/batches`, batch({ blue: 1, green: 1 }));
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toContain('paused');
    const resumed = await ctx.as('lead').post(`/watches/${watch.id}/resume`, { restart: true }).expect(200);
    expect(resumed.body).toMatchObject({ state: 'holding', alarm: false, alertState: 'none', n: 0, sequentialP: 1 });
    const history = (await ctx.as('lead').get(`/watches/${watch.id}/alerts`)).body.items;
    expect(history.map((item: { kind: string }) => item.kind)).toEqual(['cleared', 'alarm']);
  }, 60_000);

  it('resumes in the state its test says, lists waiting alarms, and deletes', async () => {
    const watch = await newWatch({ name: 'Paused and resumed' });
    await ctx.as('analyst').post(`/watches/${watch.id}/pause`).expect(200);
    expect((await ctx.as('analyst').post(`/watches/${watch.id}/pause`)).status).toBe(409);
    const resumed = await ctx.as('analyst').post(`/watches/${watch.id}/resume`, {}).expect(200);
    expect(resumed.body).toMatchObject({ state: 'holding', alertState: 'none' });
    const waiting = await ctx.as('lead').get('/watches?waiting=true').expect(200);
    expect(waiting.body.items.map((item: { id: number }) => item.id)).not.toContain(watch.id);
    expect((await ctx.as('viewer').delete(`/watches/${watch.id}`)).status).toBe(403);
    await ctx.as('analyst').delete(`/watches/${watch.id}`).expect(204);
    expect((await ctx.as('lead').get(`/watches/${watch.id}`)).status).toBe(404);
    const audit = await ctx.db('audit_events').where({ entity_type: 'watch', entity_id: String(watch.id) }).orderBy('id').pluck('action');
    expect(audit).toEqual(['create', 'update', 'update', 'delete']);
  });

  it('keeps the hypothesis fixed once batches exist', async () => {
    const watch = await newWatch();
    await ctx.as('analyst').post(`/watches/${watch.id}/batches`, batch({ blue: 3, green: 4 })).expect(201);
    const response = await ctx.as('analyst').patch(`/watches/${watch.id}`, { hypothesis: { kind: 'proportions', values: [0.6, 0.4] } });
    expect(response.status).toBe(409);
    const renamed = await ctx.as('analyst').patch(`/watches/${watch.id}`, { name: 'Renamed' }).expect(200);
    expect(renamed.body.name).toBe('Renamed');
  });

  it('appends an uploaded dataset as a batch of an upload-fed watch', async () => {
    const watch = await newWatch({ feed: { kind: 'upload' } });
    const csv = 'visitor,button\n' + Array.from({ length: 30 }, (_, i) => `${i},${i % 3 === 0 ? 'green' : 'blue'}`).join('\n') + '\n';
    const dataset = await ctx.as('analyst').post(`/studies/${studyId}/datasets`).attach('file', Buffer.from(csv), 'visits.csv').expect(201);
    const body = { datasetId: dataset.body.id, selection: { shape: 'raw', column: 'button' }, periodStart: '2026-03-02T00:00:00Z', periodEnd: '2026-03-03T00:00:00Z' };
    const appended = await ctx.as('analyst').post(`/watches/${watch.id}/batches/from-dataset`, body).expect(201);
    expect(appended.body.batch).toMatchObject({ source: 'upload', datasetId: dataset.body.id, counts: { blue: 20, green: 10 }, idempotencyKey: `dataset-${dataset.body.id}` });
    expect((await ctx.as('analyst').post(`/watches/${watch.id}/batches/from-dataset`, body).expect(200)).body.created).toBe(false);
  });

  it('keeps connection passwords out of every answer', async () => {
    const body = { name: 'Shop events', host: '127.0.0.1', port: 1, database: 'shop', user: 'reader', password: 'never shown 123' };
    expect((await ctx.as('viewer').post('/connections', body)).status).toBe(403);
    const created = await ctx.as('analyst').post('/connections', body).expect(201);
    expect(created.body).toMatchObject({ name: 'Shop events', hasPassword: true, kind: 'postgres', ssl: false });
    const listed = await ctx.as('admin').get('/connections').expect(200);
    const tested = await ctx.as('analyst').post(`/connections/${created.body.id}/test`).expect(200);
    expect(tested.body).toMatchObject({ ok: false, message: expect.stringMatching(/^could not connect/) });
    for (const answer of [created.body, listed.body, tested.body]) expect(JSON.stringify(answer)).not.toContain('never shown 123');
    const audit = await ctx.db('audit_events').where({ entity_type: 'connection' });
    expect(JSON.stringify(audit)).not.toContain('never shown 123');
  });
});
