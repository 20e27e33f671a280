/**
 * The dataset scan worker: piscina loads this file in each thread of the API's scan pool (built
 * beside main.js as dataset-scan-worker.js); each task counts one byte range of a text table and
 * answers the outcome as data.
 */
import { runRangeJob, type RangeJob, type RangeOutcome } from './app/datasets/range-count';

export function countRange(job: RangeJob): RangeOutcome {
  return runRangeJob(job);
}
