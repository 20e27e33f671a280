import { availableParallelism } from 'node:os';
import { Piscina } from 'piscina';
import type { AnalysisResult, AnalysisSpec, SegmentsInput, SegmentsResult } from '@tallyfit/engine';
import { HttpError } from '../http/http-error';
import { unwrapOutcome, type EngineRunner, type EngineTaskOutcome } from './engine-runner';

export interface EnginePoolOptions {
  /** The built worker script (engine-worker.js beside main.js). */
  workerFile: string;
  /** Longest a single run may take before it is stopped and the caller told so. */
  timeLimitMs: number;
  maxThreads?: number;
  /** Runs waiting for a thread beyond this are refused at once rather than queued without end. */
  maxQueue?: number;
}

/**
 * Engine runs in worker threads so a long exact test never blocks the event loop. The engine
 * bounds its own exact search by a work budget and falls back to Monte Carlo; the time limit
 * here is the last guard (a caller can ask for full enumeration or many samples), and an
 * aborted run ends its worker thread, so nothing keeps computing after the answer.
 */
export function createEnginePool(options: EnginePoolOptions): EngineRunner {
  const maxThreads = options.maxThreads ?? Math.max(1, availableParallelism() - 1);
  const pool = new Piscina({
    filename: options.workerFile,
    name: 'analyzeSpec',
    maxThreads,
    minThreads: 1,
    idleTimeout: 30_000,
    maxQueue: options.maxQueue ?? maxThreads * 64,
  });
  /** Runs one task (`name`: the worker's exported function) within the time limit. */
  async function run<T>(input: unknown, name: string): Promise<T> {
    const signal = AbortSignal.timeout(options.timeLimitMs);
    try {
      return unwrapOutcome((await pool.run(input, { signal, name })) as EngineTaskOutcome<T>);
    } catch (error) {
      if (signal.aborted) {
        throw new HttpError(
          422,
          'too_much_work',
          `the analysis did not finish within ${options.timeLimitMs / 1000} s; ask the exact test for Monte Carlo (exact.method "monte-carlo") or fewer samples`,
        );
      }
      if (error instanceof Error && /queue is full/i.test(error.message)) {
        throw new HttpError(503, 'busy', 'the engine is busy; try again in a moment');
      }
      throw error;
    }
  }
  return {
    analyze: (spec: AnalysisSpec) => run<AnalysisResult>(spec, 'analyzeSpec'),
    analyzeSegments: (input: SegmentsInput) => run<SegmentsResult>(input, 'analyzeSegmentsTask'),
    close: () => pool.destroy(),
  };
}
