import { DatasetFormatError } from './dataset-format-error';
import { LineError, scanDelimitedRange } from './delimited-scanner';
import { RowCounter, type CountPlan, type RowsPart } from './row-counter';

/** One byte range of a text table to count, as sent to a worker thread. */
export interface RangeJob {
  path: string;
  /** the separator's byte */
  delimiter: number;
  /** rows starting in [start, end) are counted */
  start: number;
  end: number;
  plan: CountPlan;
}

export interface RangeDone {
  part: RowsPart;
  /** just after the last row read: the next range is right only if it started here */
  stoppedAt: number;
  lineBreaks: number;
}

/** Errors cross the thread boundary as data; a line error keeps its line (counted within the range) to be renumbered. */
export type RangeOutcome =
  | { ok: true; done: RangeDone }
  | { ok: false; line: number; problem: string }
  | { ok: false; where: string; problem: string }
  | { ok: false; message: string };

export function countRange(job: RangeJob): RangeDone {
  const counter = new RowCounter(job.plan);
  const outcome = scanDelimitedRange(job.path, { delimiter: job.delimiter, start: job.start, end: job.end, capacity: job.plan.width + 1 }, counter.add);
  return { part: counter.part(), ...outcome };
}

export function runRangeJob(job: RangeJob): RangeOutcome {
  try {
    return { ok: true, done: countRange(job) };
  } catch (error) {
    if (error instanceof LineError) return { ok: false, line: error.line, problem: error.problem };
    if (error instanceof DatasetFormatError) return { ok: false, where: error.where, problem: error.problem };
    return { ok: false, message: error instanceof Error ? error.message : String(error) };
  }
}
