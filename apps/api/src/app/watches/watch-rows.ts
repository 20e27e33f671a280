import type { Knex } from 'knex';
import { Cron } from 'croner';
import type { Hypothesis } from '@tallyfit/engine';
import { WEBHOOK_SIGNATURE_HEADER, type Watch, type WatchAlertState, type WatchDetail, type WatchFeed, type WatchShare, type WatchState } from '@tallyfit/contracts';
import { isoDate } from '../http/db-time';

/** A watch as stored, with its study's and creator's names joined in. */
export interface WatchRow {
  id: number;
  study_id: number;
  study_name: string;
  name: string;
  description: string | null;
  labels_json: string;
  hypothesis_json: string;
  alpha: number;
  feed_kind: WatchFeed['kind'];
  connection_id: number | null;
  pull_query: string | null;
  schedule: string | null;
  timezone: string | null;
  webhook_url: string | null;
  webhook_secret_encrypted: string | null;
  state: WatchState;
  alarm: number | boolean;
  alert_state: WatchAlertState;
  batch_count: number;
  n: number | string;
  sequential_p: number;
  sequential_state_json: string;
  shares_json: string;
  last_batch_at: string | Date | null;
  last_period_end: string | Date | null;
  last_error: string | null;
  last_error_at: string | Date | null;
  created_by: number;
  creator_name: string;
  created_at: string | Date;
  updated_at: string | Date;
  deleted_at: string | Date | null;
}

/** Watches that are not deleted, with the names the answers show. */
export function selectWatches(db: Knex | Knex.Transaction) {
  return db('watches')
    .join('studies', 'studies.id', 'watches.study_id')
    .join('users', 'users.id', 'watches.created_by')
    .select('watches.*', 'studies.name as study_name', 'users.name as creator_name')
    .whereNull('watches.deleted_at');
}

export const watchLabels = (row: Pick<WatchRow, 'labels_json'>): string[] => JSON.parse(row.labels_json);
export const watchHypothesis = (row: Pick<WatchRow, 'hypothesis_json'>): Hypothesis => JSON.parse(row.hypothesis_json);

export function watchFeed(row: WatchRow): WatchFeed {
  if (row.feed_kind === 'pull') {
    return {
      kind: 'pull',
      connectionId: row.connection_id ?? 0,
      query: row.pull_query ?? '',
      schedule: row.schedule ?? '',
      ...(row.timezone ? { timezone: row.timezone } : {}),
    };
  }
  return { kind: row.feed_kind };
}

/** The next scheduled pull of an active pull-fed watch. */
export function nextPullAt(row: WatchRow, after = new Date()): Date | null {
  if (row.feed_kind !== 'pull' || row.state === 'paused' || !row.schedule) return null;
  return new Cron(row.schedule, { paused: true, timezone: row.timezone ?? 'UTC' }).nextRun(after);
}

export function toWatch(row: WatchRow): Watch {
  return {
    id: row.id,
    study: { id: row.study_id, name: row.study_name },
    name: row.name,
    description: row.description,
    labels: watchLabels(row),
    hypothesis: watchHypothesis(row),
    alpha: row.alpha,
    feed: watchFeed(row),
    webhook: row.webhook_url
      ? { url: row.webhook_url, hasSecret: row.webhook_secret_encrypted !== null, signatureHeader: WEBHOOK_SIGNATURE_HEADER }
      : null,
    state: row.state,
    alarm: Boolean(row.alarm),
    alertState: row.alert_state,
    batchCount: row.batch_count,
    n: Number(row.n),
    sequentialP: row.sequential_p,
    lastBatchAt: isoDate(row.last_batch_at),
    lastPeriodEnd: isoDate(row.last_period_end),
    lastError: row.last_error,
    lastErrorAt: isoDate(row.last_error_at),
    nextPullAt: nextPullAt(row)?.toISOString() ?? null,
    createdBy: { id: row.created_by, name: row.creator_name },
    createdAt: isoDate(row.created_at),
    updatedAt: isoDate(row.updated_at),
  };
}

export const toWatchDetail = (row: WatchRow): WatchDetail => ({ ...toWatch(row), shares: JSON.parse(row.shares_json) as WatchShare[] });
