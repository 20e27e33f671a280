import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { Piscina } from 'piscina';
import { runRangeJob, type RangeJob, type RangeOutcome } from './range-count';

/** Threads that count ranges: the product is sized for two cores. */
export const SCAN_THREADS = 2;

/**
 * The worker script: built beside main.js on a server (see additionalEntryPoints in
 * apps/api/project.json); from source (tests, benchmarks without a build) a small runner loads the TypeScript.
 */
export function defaultScanWorkerFile(): string {
  const built = join(__dirname, 'dataset-scan-worker.js');
  return existsSync(built) ? built : join(__dirname, '../../testing/dataset-scan-worker-runner.cjs');
}

// One pool per worker script, started on first use and kept (its threads stop when idle), so a
// scan does not pay for starting threads and compiling the scanner each time.
const pools = new Map<string, Piscina>();

function poolFor(workerFile: string): Piscina {
  let pool = pools.get(workerFile);
  if (!pool) {
    pool = new Piscina({ filename: workerFile, name: 'countRange', minThreads: 0, maxThreads: SCAN_THREADS, idleTimeout: 60_000 });
    pools.set(workerFile, pool);
  }
  return pool;
}

/** Counts each range in a pool thread, so the event loop stays free; `workerFile` null counts in this thread. */
export function countRanges(jobs: RangeJob[], workerFile: string | null): Promise<RangeOutcome[]> {
  if (workerFile === null) return Promise.resolve(jobs.map(runRangeJob));
  const pool = poolFor(workerFile);
  return Promise.all(jobs.map((job) => pool.run(job) as Promise<RangeOutcome>));
}

/** Stops the scan threads (at shutdown and after tests). */
export async function closeScanPools(): Promise<void> {
  const running = [...pools.values()];
  pools.clear();
  await Promise.all(running.map((pool) => pool.destroy()));
}
