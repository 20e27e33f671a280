/**
 * Confidence sequence for one category's share, from the Beta marginal of the Dirichlet prior.
 *
 * Counting category i against all others turns the multinomial into a binomial with share θ_i, and
 * the Dirichlet(α) prior into its Beta(a, b) marginal, a = α_i, b = c − α_i. The posterior-to-prior
 * ratio of that binomial model at a candidate share θ,
 *
 *   M_n(θ) = B(a + x, b + n − x) / B(a, b) / (θ^x (1 − θ)^{n−x}),
 *
 * is the two-category Bayes factor of dirichlet-mixture.ts against (θ, 1 − θ), a non-negative
 * martingale with mean 1 when θ is the true share. By Ville's inequality it exceeds 1/α at any
 * look with probability at most α, so {θ : M_n(θ) < 1/α} holds the true share at every look at
 * once with probability at least 1 − α (Lindon & Malek 2022, §2, the confidence sequences for the
 * multinomial shares; the prior–posterior ratio construction also in Waudby-Smith & Ramdas 2020,
 * "Confidence sequences for sampling without replacement", NeurIPS 33; sections from memory). Each category's sequence holds on its own; they are
 * not adjusted for the number of categories.
 *
 * ln M_n is convex in θ with its minimum at θ̂ = x / n, where it is at most 0 (the mixture cannot
 * beat the best fixed share), so the set is one interval around the cumulative share. The
 * intervals are not intersected across looks: intersecting would also be valid, but an interval
 * that always holds the cumulative share reads better beside it, and the state stays small.
 *
 * Each end is found on the log-odds scale u = ln(θ / (1 − θ)), which keeps relative precision
 * for shares near 0 or 1: the bracket is widened by doubling steps from θ̂ until ln M_n passes
 * ln(1/α), then the root is polished by the Illinois method (optimize/find-root.ts).
 */
import { findRoot } from '../optimize/find-root';
import { logBayesFactorFromLogShares, logMixtureProbability } from './dirichlet-mixture';

export interface ShareInterval {
  lower: number;
  upper: number;
}

/** ln θ and ln(1 − θ) for θ = 1 / (1 + e^{−u}), without forming θ. */
function logShares(u: number): [number, number] {
  return [-Math.log1p(Math.exp(-u)), -Math.log1p(Math.exp(u))];
}

const ROOT_TOLERANCE_ON_LOG_ODDS = 1e-12;
/** Beyond |u| = 1e3 the share is 0 or 1 to double precision. */
const LOG_ODDS_LIMIT = 1e3;

/**
 * The lower end of {θ : M_n(θ) < threshold} for x of n in the category, Beta(a, b) prior marginal.
 * The upper end is 1 minus the lower end of the complementary category (see shareConfidenceInterval).
 */
function lowerEnd(x: number, n: number, a: number, b: number, logThreshold: number): number {
  if (x === 0) return 0;
  const counts = [x, n - x];
  const logMixture = logMixtureProbability(counts, [a, b]);
  const excess = (u: number) => logBayesFactorFromLogShares(logMixture, counts, logShares(u)) - logThreshold;
  let near: number;
  if (x < n) {
    near = Math.log(x / (n - x));
    // Rounding can only push the minimum above the threshold when α is within rounding of 1.
    if (!(excess(near) < 0)) return x / n;
  } else {
    // All observations in the category: ln M_n falls towards its limit at θ = 1, below the threshold.
    near = 1;
    while (!(excess(near) < 0) && near < LOG_ODDS_LIMIT) near *= 2;
    if (!(excess(near) < 0)) return 1;
  }
  let step = 1;
  let far = near - step;
  while (excess(far) <= 0) {
    step *= 2;
    far = near - step;
    if (far < -LOG_ODDS_LIMIT) return 0;
  }
  const root = findRoot(excess, far, near, 0, ROOT_TOLERANCE_ON_LOG_ODDS);
  return 1 / (1 + Math.exp(-root));
}

/**
 * The confidence sequence's interval at this look for a category with `x` of `n` observations and
 * prior weight `a` out of the prior concentration `concentration`, at level 1 − alpha. Before any
 * observation it is [0, 1].
 */
export function shareConfidenceInterval(x: number, n: number, a: number, concentration: number, alpha: number): ShareInterval {
  if (n === 0) return { lower: 0, upper: 1 };
  const b = concentration - a;
  const logThreshold = -Math.log(alpha);
  return {
    lower: lowerEnd(x, n, a, b, logThreshold),
    upper: 1 - lowerEnd(n - x, n, b, a, logThreshold),
  };
}
