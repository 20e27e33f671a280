import type { Knex } from 'knex';
import type { BatchSource, Page, User, WatchBatch } from '@tallyfit/contracts';
import { isoDate } from '../http/db-time';
import { getReadableWatchRow } from './watch-access';

export interface BatchRow {
  id: number;
  watch_id: number;
  sequence: number;
  period_start: string | Date;
  period_end: string | Date;
  counts_json: string;
  n: number | string;
  idempotency_key: string;
  source: BatchSource;
  dataset_id: number | null;
  analysis_id: number;
  batch_p: number | null;
  cumulative_n: number | string;
  sequential_p: number;
  log_bayes_factor: number;
  alarm: number | boolean;
  shares_json: string;
  created_by: number | null;
  creator_name: string | null;
  created_at: string | Date;
}

export const selectBatches = (db: Knex | Knex.Transaction) =>
  db('watch_batches').leftJoin('users', 'users.id', 'watch_batches.created_by').select('watch_batches.*', 'users.name as creator_name');

export const toBatch = (row: BatchRow): WatchBatch => ({
  id: row.id,
  watchId: row.watch_id,
  sequence: row.sequence,
  periodStart: isoDate(row.period_start),
  periodEnd: isoDate(row.period_end),
  counts: JSON.parse(row.counts_json),
  n: Number(row.n),
  idempotencyKey: row.idempotency_key,
  source: row.source,
  datasetId: row.dataset_id,
  analysisId: row.analysis_id,
  batchP: row.batch_p,
  cumulativeN: Number(row.cumulative_n),
  sequentialP: row.sequential_p,
  logBayesFactor: row.log_bayes_factor,
  alarm: Boolean(row.alarm),
  shares: JSON.parse(row.shares_json),
  createdBy: row.created_by === null ? null : { id: row.created_by, name: row.creator_name ?? '' },
  createdAt: isoDate(row.created_at),
});

/** A watch's batches, oldest first (the order of the sequential test's looks). */
export async function listBatches(db: Knex, caller: User, watchId: number, page: number, pageSize: number): Promise<Page<WatchBatch>> {
  await getReadableWatchRow(db, caller, watchId);
  const [{ total }] = await db('watch_batches').where({ watch_id: watchId }).count({ total: '*' });
  const rows: BatchRow[] = await selectBatches(db)
    .where('watch_batches.watch_id', watchId)
    .orderBy('watch_batches.sequence')
    .limit(pageSize)
    .offset((page - 1) * pageSize);
  return { items: rows.map(toBatch), total: Number(total), page, pageSize };
}
