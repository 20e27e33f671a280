import { hostname } from 'node:os';
import { Cron } from 'croner';
import type { Logger } from 'pino';
import { dbTime, now } from '../http/db-time';
import { HttpError } from '../http/http-error';
import { takeInBatch } from './batch-intake';
import { runPullQuery } from './pull-query';
import { openSourceDatabase } from './source-connections.service';
import type { WatchContext } from './watch-context';
import { selectWatches, type WatchRow } from './watch-rows';

/** Longer than a pull can take (statement timeout, engine time and storing), with room to spare. */
const STALE_CLAIM_MS = 5 * 60_000;

/** How long finished pulls stay in watch_pull_ticks. */
const TICK_LOG_DAYS = 30;

export type TickOutcome = 'batch' | 'empty' | 'error' | 'skipped' | 'taken';

export interface PullScheduler {
  /** Re-reads the pull-fed watches and arms, re-arms or stops their schedules. */
  sync(): Promise<void>;
  /**
   * Runs one scheduled pull, if this server wins its lease: the unique (watch, tick time) row, so
   * of several servers on one database exactly one runs each tick ('taken' for the others).
   */
  runTick(watchId: number, tickTime: Date): Promise<TickOutcome>;
  /** Resolves once every pull under way has finished (tests wait on it). */
  idle(): Promise<void>;
  stop(): Promise<void>;
}

export interface SchedulerDeps {
  ctx: WatchContext;
  logger: Logger;
  /** How often the schedules are re-read, to follow changes made through another server. */
  syncMs?: number;
}

const scheduleKey = (row: WatchRow) => `${row.schedule}|${row.timezone ?? 'UTC'}`;
const cronOf = (row: WatchRow, callback?: (self: Cron) => void) =>
  callback
    ? new Cron(row.schedule ?? '', { timezone: row.timezone ?? 'UTC', protect: true, unref: true }, callback)
    : new Cron(row.schedule ?? '', { timezone: row.timezone ?? 'UTC', paused: true });

/**
 * Scheduled pulls with croner, one job per active pull-fed watch. Schedules live in the database,
 * so a restart re-arms them; on start, a tick missed while no server ran is caught up (its period
 * runs from the last batch's end, so nothing is counted twice or lost).
 */
export function startPullScheduler(deps: SchedulerDeps): PullScheduler {
  const { ctx, logger } = deps;
  const { db } = ctx;
  const jobs = new Map<number, { cron: Cron; key: string }>();
  const underWay = new Set<Promise<unknown>>();
  const claimant = `${hostname()}:${process.pid}`;
  let stopped = false;

  const track = <T>(work: Promise<T>): Promise<T> => {
    underWay.add(work);
    void work.finally(() => underWay.delete(work)).catch(() => undefined);
    return work;
  };

  async function finishTick(tickId: number, outcome: TickOutcome, error: string | null, batchId: number | null): Promise<void> {
    await db('watch_pull_ticks').where({ id: tickId }).update({ outcome, error, batch_id: batchId, finished_at: now(db) });
  }

  async function runTick(watchId: number, tickTime: Date): Promise<TickOutcome> {
    const tickIso = tickTime.toISOString();
    const [lease] = await db('watch_pull_ticks')
      .insert({ watch_id: watchId, tick_time: tickIso, claimed_by: claimant })
      .onConflict(['watch_id', 'tick_time'])
      .ignore()
      .returning('id');
    if (lease === undefined) return 'taken';
    const tickId = typeof lease === 'object' ? Number((lease as { id: number }).id) : Number(lease);
    await earlierTicksFinished(watchId, tickIso);
    const watch: WatchRow | undefined = await selectWatches(db).where('watches.id', watchId).first();
    if (!watch || watch.feed_kind !== 'pull' || watch.state === 'paused' || !watch.connection_id || !watch.pull_query) {
      await finishTick(tickId, 'skipped', null, null);
      return 'skipped';
    }
    const previous = cronOf(watch).previousRuns(1, tickTime)[0];
    const start = watch.last_period_end ? new Date(watch.last_period_end) : (previous ?? new Date(watch.created_at));
    try {
      const source = await openSourceDatabase(db, ctx.secretKey, watch.connection_id);
      let counts: Record<string, number>;
      try {
        counts = await runPullQuery(source, watch.pull_query, { start, end: tickTime });
      } finally {
        await source.destroy();
      }
      const total = Object.values(counts).reduce((sum, count) => sum + count, 0);
      if (total === 0) {
        await db('watches').where({ id: watchId }).update({ last_error: null, last_error_at: null });
        await finishTick(tickId, 'empty', null, null);
        return 'empty';
      }
      const { batch } = await takeInBatch(ctx, watchId, null, {
        source: 'pull',
        idempotencyKey: `pull-${tickIso}`,
        periodStart: start.toISOString(),
        periodEnd: tickIso,
        counts,
      });
      await db('watches').where({ id: watchId }).update({ last_error: null, last_error_at: null });
      await finishTick(tickId, 'batch', null, batch.id);
      return 'batch';
    } catch (error) {
      // Shown on the watch until the next pull succeeds, and kept with the tick.
      const reason = `scheduled pull at ${tickIso} failed: ${error instanceof HttpError || error instanceof Error ? error.message : String(error)}`.slice(0, 2000);
      logger.warn({ watchId, tick: tickIso, reason }, 'scheduled pull failed');
      await db('watches').where({ id: watchId }).update({ last_error: reason, last_error_at: dbTime(db, new Date().toISOString()) });
      await finishTick(tickId, 'error', reason, null);
      return 'error';
    }
  }

  /**
   * Each pull starts where the last one ended, so a tick waits while an earlier tick of the same
   * watch is still running on any server (a slow query overlapping the next scheduled time). A
   * claim older than STALE_CLAIM_MS belongs to a server that stopped mid-pull and is not waited for.
   */
  async function earlierTicksFinished(watchId: number, tickIso: string): Promise<void> {
    const deadline = Date.now() + STALE_CLAIM_MS;
    while (Date.now() < deadline && !stopped) {
      const running = await db('watch_pull_ticks')
        .where({ watch_id: watchId })
        .where('tick_time', '<', tickIso)
        .whereNull('finished_at')
        .where('claimed_at', '>', dbTime(db, new Date(Date.now() - STALE_CLAIM_MS).toISOString()))
        .first('id');
      if (!running) return;
      await new Promise((resolve) => setTimeout(resolve, 100));
    }
  }

  function arm(row: WatchRow): void {
    const cron = cronOf(row, (self) => {
      const tick = self.currentRun() ?? new Date();
      void track(runTick(row.id, tick)).catch((error: unknown) => logger.error({ err: error, watchId: row.id }, 'scheduled pull could not run'));
    });
    jobs.set(row.id, { cron, key: scheduleKey(row) });
  }

  /** The latest scheduled time already past, if no pull has covered it (a server was down then). */
  function missedTick(row: WatchRow): Date | undefined {
    const latest = cronOf(row).previousRuns(1, new Date())[0];
    if (!latest) return undefined;
    const coveredUntil = row.last_period_end ? new Date(row.last_period_end) : new Date(row.created_at);
    return latest > coveredUntil ? latest : undefined;
  }

  async function sync(catchUp = false): Promise<void> {
    if (stopped) return;
    // Finished leases are kept a while as the pulls' log, then let go so the table stays small.
    await db('watch_pull_ticks').whereNotNull('finished_at').where('claimed_at', '<', dbTime(db, new Date(Date.now() - TICK_LOG_DAYS * 86_400_000).toISOString())).del();
    const rows: WatchRow[] = await selectWatches(db).where('watches.feed_kind', 'pull').whereNot('watches.state', 'paused');
    const active = new Map(rows.map((row) => [row.id, row]));
    for (const [id, job] of jobs) {
      const row = active.get(id);
      if (!row || scheduleKey(row) !== job.key) {
        job.cron.stop();
        jobs.delete(id);
      }
    }
    for (const row of rows) {
      if (!jobs.has(row.id)) arm(row);
      const missed = catchUp ? missedTick(row) : undefined;
      if (missed) void track(runTick(row.id, missed)).catch((error: unknown) => logger.error({ err: error, watchId: row.id }, 'missed pull could not run'));
    }
  }

  const resync = () => void track(sync()).catch((error: unknown) => logger.error({ err: error }, 'schedules could not be read'));
  const timer = setInterval(resync, deps.syncMs ?? 30_000);
  timer.unref();
  void track(sync(true)).catch((error: unknown) => logger.error({ err: error }, 'schedules could not be read'));

  return {
    sync: () => track(sync()),
    runTick: (watchId, tickTime) => track(runTick(watchId, tickTime)),
    idle: async () => {
      while (underWay.size) await Promise.allSettled([...underWay]);
    },
    stop: async () => {
      stopped = true;
      clearInterval(timer);
      for (const job of jobs.values()) job.cron.stop();
      jobs.clear();
      while (underWay.size) await Promise.allSettled([...underWay]);
    },
  };
}
