/**
 * `analyzeSequential`: the whole stream at once, a fold of addSequentialBatch over the batches.
 */
import { ENGINE_VERSION } from '../engine-version';
import type { EngineWarning } from '../result/engine-warning';
import { parseWithSchema } from '../spec/parse-with-schema';
import { advanceSequential, openSequential, type SequentialLook, type SequentialState } from './sequential-state';
import { sequentialSpecSchema, type SequentialSpec } from './sequential-spec';

export interface SequentialResult {
  labels: string[];
  expectedShares: number[];
  alpha: number;
  concentration: number;
  looks: SequentialLook[];
  /** the batch (1-based) at which p first fell to α or below, or null */
  firstAlarm: number | null;
  /** how the hypothesis was read, e.g. `shares-renormalised` */
  warnings: EngineWarning[];
  engineVersion: string;
}

/** Run the sequential test over every batch. Throws EngineInputError naming each invalid field. */
export function analyzeSequential(input: SequentialSpec): SequentialResult {
  const spec = parseWithSchema(sequentialSpecSchema, input);
  const opened = openSequential({ observed: spec.observed, hypothesis: spec.hypothesis, alpha: spec.alpha, concentration: spec.concentration });
  let state: SequentialState = opened.state;
  const looks: SequentialLook[] = [];
  for (const batch of spec.batches) {
    const step = advanceSequential(state, batch);
    state = step.state;
    looks.push(step.look);
  }
  return {
    labels: state.labels,
    expectedShares: state.expectedShares,
    alpha: state.alpha,
    concentration: state.concentration,
    looks,
    firstAlarm: looks.find((look) => look.alarm)?.batch ?? null,
    warnings: opened.warnings,
    engineVersion: ENGINE_VERSION,
  };
}
