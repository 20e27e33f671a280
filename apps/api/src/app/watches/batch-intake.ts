import type { Knex } from 'knex';
import type { AnalysisSpec, Hypothesis } from '@tallyfit/engine';
import type { BatchSource, PushBatchResponse } from '@tallyfit/contracts';
import { storeAnalysis } from '../analyses/analyses.service';
import { recordAudit } from '../audit/audit.service';
import { dbTime, insertedId, now } from '../http/db-time';
import { conflict, notFound, unprocessable } from '../http/http-error';
import { countsInWatchOrder } from './batch-counts';
import { lookAfterBatch } from './sequential-test';
import type { WatchContext } from './watch-context';
import { recordAlert } from './watch-alerts.service';
import { selectBatches, toBatch, type BatchRow } from './watch-batches';
import { selectWatches, toWatch, watchHypothesis, watchLabels, type WatchRow } from './watch-rows';

/** One batch on its way in, from whichever feed. */
export interface IncomingBatch {
  source: BatchSource;
  idempotencyKey: string;
  periodStart: string;
  periodEnd: string;
  counts: Record<string, number>;
  datasetId?: number;
}

/** Who brought the batch in: a person (push, upload), or nobody for a scheduled pull. */
export type BatchActor = { id: number } | null;

const isPostgres = (db: Knex) => String(db.client.config.client) === 'pg';

/**
 * A batch's own one-look analysis uses today's tests. Expected counts given directly describe one
 * total, not every batch's, so they are tested as the shares they imply.
 */
function batchHypothesis(hypothesis: Hypothesis): Hypothesis {
  if (hypothesis.kind !== 'counts') return hypothesis;
  const total = hypothesis.values.reduce((sum, value) => sum + value, 0);
  return { kind: 'proportions', values: hypothesis.values.map((value) => value / total) };
}

async function storedBatch(db: Knex | Knex.Transaction, watchId: number, key: string): Promise<BatchRow | undefined> {
  return selectBatches(db).where({ 'watch_batches.watch_id': watchId, 'watch_batches.idempotency_key': key }).first();
}

/** A batch whose key was seen already: the stored one is the answer, nothing is counted again. */
class AlreadyStored {
  constructor(readonly row: BatchRow) {}
}

/**
 * Takes one batch into a watch: checks its categories, runs today's tests on it alone (stored as an
 * analysis of the watch's study), then, in one transaction with the audit events, stores it, takes
 * the sequential test's next look, updates the watch and records an alert when the state changed.
 * A retried idempotency key answers with the stored batch. The caller has checked access.
 */
export async function takeInBatch(ctx: WatchContext, watchId: number, actor: BatchActor, incoming: IncomingBatch): Promise<PushBatchResponse> {
  const { db } = ctx;
  const watch: WatchRow | undefined = await selectWatches(db).where('watches.id', watchId).first();
  if (!watch) throw notFound(`watch ${watchId} does not exist`);
  const seen = await storedBatch(db, watchId, incoming.idempotencyKey);
  if (seen) return { batch: toBatch(seen), created: false, watch: toWatch(watch) };
  if (watch.feed_kind !== incoming.source) {
    throw conflict(`watch ${watchId} is fed by ${watch.feed_kind}, not by ${incoming.source}; change its feed to take ${incoming.source} batches`);
  }
  if (watch.state === 'paused') throw conflict(`watch ${watchId} is paused; resume it before sending batches`);
  const labels = watchLabels(watch);
  const counts = countsInWatchOrder(labels, incoming.counts, incoming.source === 'pull' ? 'zero' : 'refuse');
  const n = counts.reduce((sum, count) => sum + count, 0);
  if (n === 0) throw unprocessable('the batch holds no observations (every count is 0)', [{ path: 'counts', message: 'all counts are 0' }]);

  const spec: AnalysisSpec = { observed: { labels, counts }, hypothesis: batchHypothesis(watchHypothesis(watch)), alpha: watch.alpha };
  const result = await ctx.engine.analyze(spec);
  const author = actor ?? { id: watch.created_by };

  let alerted = false;
  const outcome = await db
    .transaction(async (trx) => {
      // One batch at a time per watch: PostgreSQL locks the row; SQLite runs one writer anyway.
      const current: WatchRow = await trx('watches').where({ id: watchId }).modify((builder) => (isPostgres(db) ? builder.forUpdate() : builder)).first();
      if (current.deleted_at !== null) throw notFound(`watch ${watchId} does not exist`);
      const raced = await storedBatch(trx, watchId, incoming.idempotencyKey);
      if (raced) throw new AlreadyStored(raced);
      if (current.state === 'paused') throw conflict(`watch ${watchId} is paused; resume it before sending batches`);

      const sequence = current.batch_count + 1;
      const look = lookAfterBatch(JSON.parse(current.sequential_state_json), counts);
      const analysisId = await storeAnalysis(
        trx,
        author,
        {
          title: `${watch.name}: batch ${sequence}`,
          notes: `Batch ${sequence} of the watch "${watch.name}" (${incoming.source}), ${incoming.periodStart} to ${incoming.periodEnd}, tested on its own.`,
          spec,
          studyId: watch.study_id,
          datasetId: incoming.datasetId,
        },
        result,
      );
      const [inserted] = await trx('watch_batches')
        .insert({
          watch_id: watchId,
          sequence,
          period_start: dbTime(db, incoming.periodStart),
          period_end: dbTime(db, incoming.periodEnd),
          counts_json: JSON.stringify(Object.fromEntries(labels.map((label, i) => [label, counts[i]]))),
          n,
          idempotency_key: incoming.idempotencyKey,
          source: incoming.source,
          dataset_id: incoming.datasetId ?? null,
          analysis_id: analysisId,
          batch_p: result.conclusion.p,
          cumulative_n: look.n,
          sequential_p: look.p,
          log_bayes_factor: look.logBayesFactor,
          alarm: look.alarm,
          shares_json: JSON.stringify(look.shares),
          created_by: actor?.id ?? null,
        })
        .returning('id');
      const batchId = insertedId(inserted);
      const periodEnd = new Date(incoming.periodEnd);
      const lastEnd = current.last_period_end ? new Date(current.last_period_end) : undefined;
      await trx('watches')
        .where({ id: watchId })
        .update({
          batch_count: sequence,
          n: look.n,
          sequential_p: look.p,
          alarm: look.alarm,
          state: look.alarm ? 'alarm' : 'holding',
          sequential_state_json: JSON.stringify(look.state),
          shares_json: JSON.stringify(look.shares),
          last_batch_at: now(trx),
          last_period_end: dbTime(db, (lastEnd && lastEnd > periodEnd ? lastEnd : periodEnd).toISOString()),
          updated_at: now(trx),
        });
      if (look.alarm !== Boolean(current.alarm)) {
        alerted = await recordAlert(trx, ctx, watch, look.alarm ? 'alarm' : 'cleared', look.p, look.shares, {
          id: batchId,
          periodStart: incoming.periodStart,
          periodEnd: incoming.periodEnd,
          cumulativeN: look.n,
        });
      }
      await recordAudit(trx, {
        actorId: actor?.id ?? null,
        action: 'create',
        entityType: 'watch-batch',
        entityId: batchId,
        studyId: watch.study_id,
        summary: `took batch ${sequence} (${incoming.source}, n = ${n}) into watch "${watch.name}"${look.alarm !== Boolean(current.alarm) ? (look.alarm ? ': alarm' : ': holding again') : ''}`,
        after: { watchId, idempotencyKey: incoming.idempotencyKey, n, sequentialP: look.p, alarm: look.alarm },
      });
      return batchId;
    })
    .catch((error: unknown) => {
      if (error instanceof AlreadyStored) return error;
      throw error;
    });
  if (outcome instanceof AlreadyStored) {
    return { batch: toBatch(outcome.row), created: false, watch: toWatch(await selectWatches(db).where('watches.id', watchId).first()) };
  }
  if (alerted) ctx.deliveriesQueued();
  const [row] = await selectBatches(db).where('watch_batches.id', outcome);
  return { batch: toBatch(row), created: true, watch: toWatch(await selectWatches(db).where('watches.id', watchId).first()) };
}
