/**
 * Shares given directly (proportions) or through expected counts. Totals within 1e-6 of the
 * target are used as given; totals off by a rounding-sized amount are renormalised with a warning.
 */
import { SHARE_SUM_EXACT_TOLERANCE } from '../spec/share-tolerance';
import type { EngineWarning } from '../result/engine-warning';

export interface NormalisedShares {
  shares: number[];
  warnings: EngineWarning[];
}

function total(values: readonly number[]): number {
  return values.reduce((sum, value) => sum + value, 0);
}

/** Proportions that should sum to 1. */
export function sharesFromProportions(values: readonly number[]): NormalisedShares {
  const sum = total(values);
  const shares = values.map((value) => value / sum);
  if (Math.abs(sum - 1) <= SHARE_SUM_EXACT_TOLERANCE) return { shares, warnings: [] };
  return {
    shares,
    warnings: [
      {
        code: 'shares-renormalised',
        message: `The expected proportions summed to ${sum.toPrecision(6)}, not 1; they were treated as rounded figures and rescaled to sum to 1.`,
      },
    ],
  };
}

/** Expected counts that should sum to the observed total n. */
export function sharesFromExpectedCounts(values: readonly number[], n: number): NormalisedShares {
  const sum = total(values);
  const shares = values.map((value) => value / sum);
  if (Math.abs(sum - n) <= SHARE_SUM_EXACT_TOLERANCE * n) return { shares, warnings: [] };
  return {
    shares,
    warnings: [
      {
        code: 'expected-counts-rescaled',
        message: `The expected counts summed to ${sum.toPrecision(8)} but ${n} observations were made; they were treated as rounded figures and rescaled to sum to ${n}.`,
      },
    ],
  };
}
