/**
 * The Dirichlet–multinomial mixture behind the sequential test (Lindon & Malek 2022, "Anytime-valid
 * inference for multinomial count data", NeurIPS 35, arXiv 2011.03567, §2, section from memory).
 *
 * With a Dirichlet(α) prior on the shares and cumulative counts x (total n, c = Σα), the probability
 * of the observed sequence of category draws under the mixture is
 *
 *   m(x) = Γ(c) / Γ(c + n) · Π Γ(α_i + x_i) / Γ(α_i),
 *
 * and its ratio to the probability under fixed shares θ is the Bayes factor
 *
 *   BF_n(θ) = m(x) / Π θ_i^{x_i},
 *
 * a non-negative martingale with mean 1 when the draws follow θ (the multinomial coefficient is the
 * same in both and cancels). Both are computed in logarithms.
 *
 * Numerics: ln Γ(c + n) alone is about n ln n, so subtracting ln Γ terms directly loses
 * ε · n ln n. Writing each ln Γ(z) = (z − ½) ln z − z + ½ ln 2π + δ(z) (δ Stirling's error) and
 * grouping by the posterior mean shares p̂_i = (α_i + x_i) / (c + n), the −z terms cancel exactly:
 *
 *   ln m(x) = Σ (α_i + x_i − ½) ln p̂_i − ((k − 1)/2) ln(c + n) + (k − 1) · ½ ln 2π
 *             + Σ δ(α_i + x_i) − δ(c + n) − Σ ln Γ(α_i) + ln Γ(c),
 *
 * whose largest term is about n · |ln p̂|, so the error stays near ε · n even at n = 10⁹.
 */
import { logGamma, stirlingError } from '../special/log-gamma';

const HALF_LOG_TWO_PI = 0.9189385332046727;

/**
 * ln m(x): the log probability of the observed sequence under the Dirichlet(prior) mixture.
 * `prior` holds α_i > 0; `counts` whole numbers ≥ 0 of the same length.
 */
export function logMixtureProbability(counts: readonly number[], prior: readonly number[]): number {
  const k = counts.length;
  let concentration = 0;
  let n = 0;
  for (let i = 0; i < k; i++) {
    concentration += prior[i];
    n += counts[i];
  }
  if (n === 0) return 0;
  const total = concentration + n;
  let value = (-(k - 1) / 2) * Math.log(total) + (k - 1) * HALF_LOG_TWO_PI - stirlingError(total) + logGamma(concentration);
  for (let i = 0; i < k; i++) {
    const posterior = prior[i] + counts[i];
    value += (posterior - 0.5) * Math.log(posterior / total) + stirlingError(posterior) - logGamma(prior[i]);
  }
  return value;
}

/**
 * ln BF_n(θ) = ln m(x) − Σ x_i ln θ_i, taking the shares as logarithms so that callers searching
 * over θ near 0 or 1 keep full precision. Categories with no counts contribute nothing, so a share
 * of 0 (ln θ = −∞) is allowed where nothing was observed.
 */
export function logBayesFactorFromLogShares(logMixture: number, counts: readonly number[], logShares: readonly number[]): number {
  let value = logMixture;
  for (let i = 0; i < counts.length; i++) {
    if (counts[i] > 0) value -= counts[i] * logShares[i];
  }
  return value;
}

/** ln BF_n(θ0) of the Dirichlet(prior) mixture against the null shares θ0 (all above 0 where counted). */
export function logBayesFactor(counts: readonly number[], prior: readonly number[], shares: readonly number[]): number {
  return logBayesFactorFromLogShares(
    logMixtureProbability(counts, prior),
    counts,
    shares.map((share) => Math.log(share)),
  );
}
