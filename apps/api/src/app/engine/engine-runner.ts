import { analyze, EngineInputError, type AnalysisResult, type AnalysisSpec, type InputIssue } from '@tallyfit/engine';

/** Runs the engine for the API. The server uses a worker pool; tests may choose to run in-process. */
export interface EngineRunner {
  analyze(spec: AnalysisSpec, options?: EngineRunOptions): Promise<AnalysisResult>;
  close(): Promise<void>;
}

export interface EngineRunOptions {
  /** Who asked (a person's id): the worker pool takes turns between owners. */
  owner?: string;
}

/** What a worker sends back: a result, or the input problems the engine named. */
export type EngineTaskOutcome = { ok: true; result: AnalysisResult } | { ok: false; issues: InputIssue[] };

/** The work one task does, shared by the worker and the in-process runner. */
export function runAnalysisTask(spec: unknown): EngineTaskOutcome {
  try {
    return { ok: true, result: analyze(spec as AnalysisSpec) };
  } catch (error) {
    // Errors cross the thread boundary as plain objects, so input problems are sent as data.
    if (error instanceof EngineInputError) return { ok: false, issues: error.issues };
    throw error;
  }
}

export function unwrapOutcome(outcome: EngineTaskOutcome): AnalysisResult {
  if (outcome.ok) return outcome.result;
  throw new EngineInputError(outcome.issues);
}

/**
 * Runs the engine on the calling thread. Only for tests (chosen explicitly through
 * `createTestApp`) and one-off scripts such as the demo seed: on a server it would block the
 * event loop during a long exact test.
 */
export function inProcessEngine(): EngineRunner {
  return {
    analyze: async (spec) => unwrapOutcome(runAnalysisTask(spec)),
    close: async () => undefined,
  };
}
