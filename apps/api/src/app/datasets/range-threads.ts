import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { Worker } from 'node:worker_threads';
import { runRangeJob, type RangeJob, type RangeOutcome } from './range-count';

/**
 * The worker script: built beside main.js on a server (see additionalEntryPoints in
 * apps/api/project.json); from source (tests, benchmarks) a small runner loads the TypeScript.
 */
export function defaultScanWorkerFile(): string {
  const built = join(__dirname, 'dataset-scan-worker.js');
  return existsSync(built) ? built : join(__dirname, '../../testing/dataset-scan-worker-runner.cjs');
}

/** Counts each range in a worker thread of its own, so the event loop stays free; `workerFile` null counts in this thread. */
export function countRanges(jobs: RangeJob[], workerFile: string | null): Promise<RangeOutcome[]> {
  if (workerFile === null) return Promise.resolve(jobs.map(runRangeJob));
  return Promise.all(jobs.map((job) => inWorker(job, workerFile)));
}

function inWorker(job: RangeJob, workerFile: string): Promise<RangeOutcome> {
  return new Promise((resolve, reject) => {
    const worker = new Worker(workerFile, { workerData: job });
    let answered = false;
    worker.once('message', (outcome: RangeOutcome) => {
      answered = true;
      resolve(outcome);
    });
    worker.once('error', reject);
    worker.once('exit', (code) => {
      if (!answered) reject(new Error(`the dataset scan worker stopped (exit code ${code}) before answering`));
    });
  });
}
