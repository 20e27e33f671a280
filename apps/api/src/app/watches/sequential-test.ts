import { addSequentialBatch, EngineInputError, startSequential, type Hypothesis, type SequentialState } from '@tallyfit/engine';
import type { WatchShare } from '@tallyfit/contracts';
import { unprocessable } from '../http/http-error';

/** One look of the engine's anytime-valid sequential test, as a watch stores it. */
export interface SequentialLook {
  state: SequentialState;
  n: number;
  p: number;
  logBayesFactor: number;
  alarm: boolean;
  shares: WatchShare[];
}

/**
 * A fresh sequential test for a watch's categories and hypothesis. The engine refuses what it
 * cannot test sequentially (e.g. a hypothesis with estimated parameters): a 422 naming why.
 */
export function beginSequentialTest(labels: string[], hypothesis: Hypothesis, alpha: number): SequentialState {
  try {
    return startSequential({ observed: { labels }, hypothesis, alpha });
  } catch (error) {
    if (error instanceof EngineInputError) {
      throw unprocessable(`the sequential test cannot take this watch: ${error.message}`, error.issues.map((issue) => ({ path: issue.path, message: issue.message })));
    }
    throw error;
  }
}

/** The next look after one batch of counts (in the watch's category order). */
export function lookAfterBatch(state: SequentialState, counts: number[]): SequentialLook {
  const { state: next, look } = addSequentialBatch(state, counts);
  return { state: next, n: look.n, p: look.p, logBayesFactor: look.logBayesFactor, alarm: look.alarm, shares: look.shares };
}
