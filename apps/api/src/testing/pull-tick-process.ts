/**
 * One API server's scheduler in a process of its own, for the test that two servers on one
 * database run each scheduled pull exactly once. Reads DATABASE_URL (or TALLYFIT_DATA_DIR for
 * SQLite), TALLYFIT_SECRET_KEY, WATCH_ID and TICKS (ISO times, comma-separated), runs every tick
 * as the cron job would, and prints the outcomes as JSON.
 */
import pino from 'pino';
import { loadConfig } from '../app/config';
import { openDatabase } from '../app/database';
import { inProcessEngine } from '../app/engine/engine-runner';
import { startPullScheduler } from '../app/watches/pull-scheduler';

async function main(): Promise<void> {
  const config = loadConfig(process.env);
  const db = openDatabase(config);
  const watchId = Number(process.env['WATCH_ID']);
  const ticks = (process.env['TICKS'] ?? '').split(',').map((text) => new Date(text));
  const scheduler = startPullScheduler({
    ctx: { db, engine: inProcessEngine(), secretKey: config.secretKey, publicUrl: config.publicUrl, scheduleChanged: () => undefined, deliveriesQueued: () => undefined },
    logger: pino({ level: 'silent' }),
    syncMs: 3_600_000,
  });
  const outcomes: string[] = [];
  for (const tick of ticks) outcomes.push(await scheduler.runTick(watchId, tick));
  await scheduler.stop();
  await db.destroy();
  process.stdout.write(JSON.stringify({ pid: process.pid, outcomes }) + '\n');
}

main().catch((error: unknown) => {
  process.stderr.write(String(error instanceof Error ? error.stack : error) + '\n');
  process.exitCode = 1;
});
