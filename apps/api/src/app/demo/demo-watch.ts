import type { Knex } from 'knex';
import { createWatchRequestSchema, type User } from '@tallyfit/contracts';
import type { EngineRunner } from '../engine/engine-runner';
import { takeInBatch } from '../watches/batch-intake';
import { acknowledgeAlert } from '../watches/watch-alerts.service';
import { createWatch } from '../watches/watches.service';

/** The invented experiment the demo watch follows: three button colours meant to get a third of visitors each. */
export const DEMO_WATCH = {
  name: 'Checkout button colour trial: traffic split',
  description:
    'Invented demo: visitors to the made-up shop\'s checkout are assigned to one of three button colours, a third each. A pipeline pushes each period\'s visitors per colour.',
  labels: ['Slate button', 'Teal button', 'Amber button'],
  batches: 20,
  visitorsPerBatch: 1500,
  /** From this batch on, a (made-up) caching fault sends some Amber visitors to Slate. */
  faultFromBatch: 13,
  faultShares: [0.365, 0.335, 0.3],
};

/** A small seeded generator (mulberry32), so the demo history is the same on every machine. */
function seededRandom(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** One period's visitors, each assigned by the given shares. */
function visitorsPerColour(random: () => number, visitors: number, shares: number[]): number[] {
  const counts = shares.map(() => 0);
  for (let visitor = 0; visitor < visitors; visitor++) {
    let draw = random();
    let colour = 0;
    while (colour < shares.length - 1 && draw >= shares[colour]) draw -= shares[colour++];
    counts[colour]++;
  }
  return counts;
}

/**
 * A push-fed watch with a day of four-hourly history: balanced at first, then the fault tilts the
 * split until the sequential test alarms; the lead has acknowledged the alarm. Its alert e-mails
 * wait in the deliveries and go to the mail stand-in when the server starts.
 */
export async function seedDemoWatch(
  trx: Knex.Transaction,
  engine: EngineRunner,
  people: { analyst: User; lead: User },
  studyId: number,
  publicUrl: string,
): Promise<void> {
  const ctx = {
    db: trx,
    engine,
    // The demo watch has no webhook and no connection: nothing is sealed with this key.
    secretKey: Buffer.alloc(0),
    publicUrl,
    scheduleChanged: () => undefined,
    deliveriesQueued: () => undefined,
  };
  const watch = await createWatch(
    ctx,
    people.analyst,
    createWatchRequestSchema.parse({
      studyId,
      name: DEMO_WATCH.name,
      description: DEMO_WATCH.description,
      labels: DEMO_WATCH.labels,
      hypothesis: { kind: 'equal' },
      alpha: 0.05,
      feed: { kind: 'push' },
    }),
  );
  const random = seededRandom(20261202);
  const hour = 3_600_000;
  const firstStart = Math.floor(Date.now() / hour) * hour - DEMO_WATCH.batches * 4 * hour;
  for (let batch = 1; batch <= DEMO_WATCH.batches; batch++) {
    const shares = batch >= DEMO_WATCH.faultFromBatch ? DEMO_WATCH.faultShares : [1 / 3, 1 / 3, 1 / 3];
    const counts = visitorsPerColour(random, DEMO_WATCH.visitorsPerBatch, shares);
    const start = firstStart + (batch - 1) * 4 * hour;
    await takeInBatch(ctx, watch.id, people.analyst, {
      source: 'push',
      idempotencyKey: `demo-checkout-${batch}`,
      periodStart: new Date(start).toISOString(),
      periodEnd: new Date(start + 4 * hour).toISOString(),
      counts: Object.fromEntries(DEMO_WATCH.labels.map((label, i) => [label, counts[i]])),
    });
  }
  const alarm = await trx('watch_alerts').where({ watch_id: watch.id, kind: 'alarm' }).first('id');
  if (alarm) {
    await acknowledgeAlert(trx, people.lead, alarm.id, 'Seen. The shop team traces the Amber shortfall to a caching rule; the trial is extended until the split is fixed.');
  }
}
