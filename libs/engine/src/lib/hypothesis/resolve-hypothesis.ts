/**
 * Turn the spec's hypothesis into one expected share per category.
 */
import type { AnalysisSpec } from '../spec/analysis-spec';
import { sharesFromExpectedCounts, sharesFromProportions } from './given-shares';
import { formatRatio, sharesFromRatio } from './ratio-shares';
import type { ResolvedHypothesis } from './resolved-hypothesis';
import { fitDistribution } from './distribution/fit-distribution';

function describeShares(shares: readonly number[]): string {
  return shares.map((share) => String(Number(share.toPrecision(4)))).join(', ');
}

export function resolveHypothesis(spec: AnalysisSpec): ResolvedHypothesis {
  const { labels, counts } = spec.observed;
  const hypothesis = spec.hypothesis;
  const n = counts.reduce((sum, c) => sum + c, 0);
  const k = labels.length;
  switch (hypothesis.kind) {
    case 'equal':
      return {
        shares: labels.map(() => 1 / k),
        estimatedParameters: hypothesis.estimatedParameters ?? 0,
        description: `equal shares across the ${k} categories`,
        notes: [],
        warnings: [],
      };
    case 'proportions': {
      const { shares, warnings } = sharesFromProportions(hypothesis.values);
      return {
        shares,
        estimatedParameters: hypothesis.estimatedParameters ?? 0,
        description: `the expected proportions ${describeShares(shares)}`,
        notes: warnings.length > 0 ? ['The expected proportions were rescaled to sum to 1.'] : [],
        warnings,
      };
    }
    case 'ratio':
      return {
        shares: sharesFromRatio(hypothesis.values),
        estimatedParameters: hypothesis.estimatedParameters ?? 0,
        description: `the expected ratio ${formatRatio(hypothesis.values)}`,
        notes: [],
        warnings: [],
      };
    case 'counts': {
      const { shares, warnings } = sharesFromExpectedCounts(hypothesis.values, n);
      return {
        shares,
        estimatedParameters: hypothesis.estimatedParameters ?? 0,
        description: 'the given expected counts',
        notes: warnings.length > 0 ? [`The expected counts were rescaled to sum to ${n}.`] : [],
        warnings,
      };
    }
    case 'distribution':
      return fitDistribution(labels, counts, hypothesis);
  }
}
