/**
 * The sequential test in incremental form: `startSequential` fixes the categories, the null
 * shares θ0, α and the prior; `addSequentialBatch` adds one batch of counts and returns the new
 * state with the look it produced. The state is plain JSON, so a service can store it and add the
 * next batch later without replaying the history.
 *
 * At each look (Lindon & Malek 2022, §2):
 * - the Bayes factor BF_n of the Dirichlet(c · θ0) mixture against θ0 (dirichlet-mixture.ts);
 * - the anytime-valid p-value p_n = min(1, min_{m ≤ n} 1 / BF_m), never increasing. BF_n is a
 *   non-negative martingale with mean 1 under the null, so by Ville's inequality
 *   P(BF_n ≥ 1/α at some look) ≤ α, i.e. P(p_n ≤ α at some look) ≤ α however often one looks
 *   and whenever one stops (Ville 1939, "Étude critique de la notion de collectif");
 * - the alarm: p_n ≤ α; once raised it stays raised, as p_n never increases;
 * - each share's cumulative estimate x_i / n with its confidence sequence
 *   (share-confidence-sequence.ts) at level 1 − α.
 */
import { z } from 'zod';
import { DEFAULT_ALPHA } from '../analyze';
import { EngineInputError } from '../spec/engine-input-error';
import { parseWithSchema } from '../spec/parse-with-schema';
import { logBayesFactor } from './dirichlet-mixture';
import { nullShares } from './null-shares';
import { shareConfidenceInterval } from './share-confidence-sequence';
import {
  batchCountsSchema,
  concentrationSchema,
  DEFAULT_CONCENTRATION,
  sequentialAlphaSchema,
  sequentialStartSchema,
  type SequentialStartSpec,
} from './sequential-spec';
import type { EngineWarning } from '../result/engine-warning';

export interface SequentialState {
  labels: string[];
  /** θ0, summing to 1, every share above 0 */
  expectedShares: number[];
  alpha: number;
  /** c: the Dirichlet prior is α_i = c · θ0_i */
  concentration: number;
  /** cumulative counts per category */
  counts: number[];
  /** batches added so far */
  batches: number;
  /** the running minimum p: the anytime-valid p-value so far (1 before any batch) */
  p: number;
}

export interface SequentialShare {
  label: string;
  /** θ0_i */
  expected: number;
  /** cumulative share x_i / n (the expected share before any observation) */
  estimate: number;
  /** confidence sequence at level 1 − α for this share, valid at every look */
  lower: number;
  upper: number;
}

export interface SequentialLook {
  /** 1 for the first batch */
  batch: number;
  /** cumulative number of observations */
  n: number;
  /** cumulative counts per category */
  counts: number[];
  /** anytime-valid p-value, never increasing from look to look */
  p: number;
  /** ln BF_n at this look (not the running maximum) */
  logBayesFactor: number;
  /** p ≤ α */
  alarm: boolean;
  shares: SequentialShare[];
}

const SHARE_SUM_CHECK = 1e-9;

/** A stored state is checked before use: it may come from a database or another process. */
export const sequentialStateSchema = z
  .strictObject({
    labels: z.array(z.string({ error: 'each label must be a string' })).min(2, { error: 'at least 2 categories are needed' }),
    expectedShares: z.array(
      z.number({ error: 'each expected share must be a finite number' }).gt(0, { error: 'expected shares must be above 0' }),
    ),
    alpha: sequentialAlphaSchema,
    concentration: concentrationSchema,
    counts: batchCountsSchema,
    batches: z.number({ error: 'batches must be a finite number' }).int({ error: 'batches must be a whole number' }).nonnegative({ error: 'batches must not be negative' }),
    p: z.number({ error: 'p must be a finite number' }).min(0, { error: 'p must not be negative' }).max(1, { error: 'p must be at most 1' }),
  })
  .superRefine((state, context) => {
    const k = state.labels.length;
    if (state.expectedShares.length !== k) {
      context.addIssue({ code: 'custom', path: ['expectedShares'], message: `expectedShares has ${state.expectedShares.length} entries but there are ${k} labels` });
    } else if (Math.abs(state.expectedShares.reduce((sum, share) => sum + share, 0) - 1) > SHARE_SUM_CHECK) {
      context.addIssue({ code: 'custom', path: ['expectedShares'], message: 'expectedShares must sum to 1' });
    }
    if (state.counts.length !== k) {
      context.addIssue({ code: 'custom', path: ['counts'], message: `counts has ${state.counts.length} entries but there are ${k} labels` });
    }
  });

/** The state and the warnings about how the hypothesis was read (e.g. proportions rescaled). */
export function openSequential(input: SequentialStartSpec): { state: SequentialState; warnings: EngineWarning[] } {
  const spec = parseWithSchema(sequentialStartSchema, input);
  const { shares, warnings } = nullShares(spec);
  return {
    state: {
      labels: [...spec.observed.labels],
      expectedShares: shares,
      alpha: spec.alpha ?? DEFAULT_ALPHA,
      concentration: spec.concentration ?? DEFAULT_CONCENTRATION,
      counts: shares.map(() => 0),
      batches: 0,
      p: 1,
    },
    warnings,
  };
}

/** A new sequential test with no batches yet. Throws EngineInputError naming each invalid field. */
export function startSequential(spec: SequentialStartSpec): SequentialState {
  return openSequential(spec).state;
}

/** Add one batch to a state already checked; shared by addSequentialBatch and analyzeSequential. */
export function advanceSequential(state: SequentialState, batchCounts: readonly number[]): { state: SequentialState; look: SequentialLook } {
  const counts = state.counts.map((count, i) => count + batchCounts[i]);
  const n = counts.reduce((sum, count) => sum + count, 0);
  if (n > Number.MAX_SAFE_INTEGER) throw EngineInputError.at('counts', 'the cumulative count must be at most 2^53 − 1');
  const prior = state.expectedShares.map((share) => state.concentration * share);
  const logBf = logBayesFactor(counts, prior, state.expectedShares);
  const p = Math.min(state.p, Math.exp(-logBf));
  const shares = state.labels.map((label, i) => {
    const interval = shareConfidenceInterval(counts[i], n, prior[i], state.concentration, state.alpha);
    return {
      label,
      expected: state.expectedShares[i],
      estimate: n === 0 ? state.expectedShares[i] : counts[i] / n,
      lower: interval.lower,
      upper: interval.upper,
    };
  });
  const batch = state.batches + 1;
  return {
    state: { ...state, labels: [...state.labels], expectedShares: [...state.expectedShares], counts, batches: batch, p },
    look: { batch, n, counts: [...counts], p, logBayesFactor: logBf, alarm: p <= state.alpha, shares },
  };
}

/**
 * Add one batch of counts (one per category, in label order) to a stored state. Returns the new
 * state (the old one is not changed) and the look. Throws EngineInputError naming the field
 * (`state.…` or `counts.…`) when either is invalid.
 */
export function addSequentialBatch(state: SequentialState, batchCounts: readonly number[]): { state: SequentialState; look: SequentialLook } {
  const checked = parseWithSchema(sequentialStateSchema, state, 'state');
  const counts = parseWithSchema(batchCountsSchema, batchCounts, 'counts');
  if (counts.length !== checked.labels.length) {
    throw EngineInputError.at('counts', `the batch has ${counts.length} counts but there are ${checked.labels.length} categories`);
  }
  return advanceSequential(checked, counts);
}
