/**
 * The engine worker: piscina loads this file in each worker thread of the API's engine pool
 * (built beside main.js as engine-worker.js).
 */
import type { SegmentsResult } from '@tallyfit/engine';
import { runAnalysisTask, runSegmentsTask, type EngineTaskOutcome } from './app/engine/engine-runner';

export function analyzeSpec(spec: unknown): EngineTaskOutcome {
  return runAnalysisTask(spec);
}

export function analyzeSegmentsTask(input: unknown): EngineTaskOutcome<SegmentsResult> {
  return runSegmentsTask(input);
}
