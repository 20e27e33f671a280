/**
 * The dataset scan worker: counts one byte range of an uploaded text table in its own thread
 * (built beside main.js as dataset-scan-worker.js) and posts the outcome back as data.
 */
import { parentPort, workerData } from 'node:worker_threads';
import { runRangeJob, type RangeJob } from './app/datasets/range-count';

parentPort?.postMessage(runRangeJob(workerData as RangeJob));
