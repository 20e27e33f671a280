/**
 * Anytime-valid sequential test of a multinomial hypothesis with confidence sequences for the
 * shares: look after every batch and keep the chance of a false alarm at or below α.
 *
 * Source: Lindon & Malek (2022), "Anytime-valid inference for multinomial count data", NeurIPS 35,
 * arXiv 2011.03567, §2 (section from memory: the paper's text was not at hand, so no equation
 * numbers are cited; every formula is written out where it is coded). Coded:
 * - the Dirichlet–multinomial Bayes factor against the null shares θ0 with prior α = c · θ0
 *   (dirichlet-mixture.ts);
 * - the sequential p-value p_n = min(1, min_{m ≤ n} 1 / BF_m) and the alarm p_n ≤ α, valid by
 *   Ville's inequality (sequential-state.ts);
 * - a confidence sequence per share from the posterior-to-prior ratio of the prior's Beta
 *   marginal (share-confidence-sequence.ts).
 * Defaults: α = 0.05, as for `analyze`; concentration c = 100, chosen in sequential-spec.ts.
 * Checked against 50-digit mpmath values written by tools/fixtures/sequential-reference.py.
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
