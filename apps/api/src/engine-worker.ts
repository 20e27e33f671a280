/**
 * The engine worker: piscina loads this file in each worker thread of the API's engine pool
 * (built beside main.js as engine-worker.js).
 */
import { runAnalysisTask, type EngineTaskOutcome } from './app/engine/engine-runner';

export function analyzeSpec(spec: unknown): EngineTaskOutcome {
  return runAnalysisTask(spec);
}
