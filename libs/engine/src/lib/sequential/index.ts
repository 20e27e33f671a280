/**
 * Anytime-valid sequential test of a multinomial hypothesis with confidence sequences for the
 * shares (Lindon & Malek 2022): look after every batch and keep the chance of a false alarm at
 * or below α. See sequential-state.ts for what each look holds.
 */
export { analyzeSequential, type SequentialResult } from './analyze-sequential';
export {
  startSequential,
  addSequentialBatch,
  sequentialStateSchema,
  type SequentialState,
  type SequentialLook,
  type SequentialShare,
} from './sequential-state';
export {
  sequentialSpecSchema,
  sequentialStartSchema,
  DEFAULT_CONCENTRATION,
  type SequentialSpec,
  type SequentialStartSpec,
} from './sequential-spec';
export { logBayesFactor, logMixtureProbability } from './dirichlet-mixture';
export { shareConfidenceInterval, type ShareInterval } from './share-confidence-sequence';
