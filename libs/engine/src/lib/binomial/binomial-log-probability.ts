/**
 * ln P(X = x) for X ~ Binomial(n, p), by Loader's (2000) saddle-point formula
 *   P(X = x) = exp(−δ(n) + δ(x) + δ(n − x) − D(x, np) − D(n − x, n(1 − p))) √(n / (2π x (n − x))),
 * accurate to ~1e-13 relative for any n (Loader 2000, "Fast and accurate computation of binomial
 * probabilities").
 */
import { stirlingError } from '../special/log-gamma';
import { devianceTerm } from '../special/poisson-density';

const LOG_TWO_PI = 1.8378770664093453;

export function binomialLogProbability(x: number, n: number, p: number): number {
  if (x < 0 || x > n) return -Infinity;
  const q = 1 - p;
  if (p === 0) return x === 0 ? 0 : -Infinity;
  if (q === 0) return x === n ? 0 : -Infinity;
  if (x === 0) return n * Math.log1p(-p);
  if (x === n) return n * Math.log(p);
  const logBody =
    stirlingError(n) - stirlingError(x) - stirlingError(n - x) - devianceTerm(x, n * p) - devianceTerm(n - x, n * q);
  return logBody + 0.5 * (Math.log(n) - LOG_TWO_PI - Math.log(x) - Math.log(n - x));
}

/**
 * ln P(X = j) − ln P(X = x), taken term by term from Loader's form so that the difference of two
 * nearby log-probabilities keeps its absolute accuracy (~1e-16) instead of inheriting the rounding
 * of each (~1e-15 when they are near −20). The exact tests compare this with ln(1 + 1e-7) to decide
 * ties, which needs it.
 */
export function binomialLogProbabilityRatio(j: number, x: number, n: number, p: number): number {
  if (j === x) return 0;
  if (j <= 0 || x <= 0 || j >= n || x >= n || p === 0 || p === 1) {
    return binomialLogProbability(j, n, p) - binomialLogProbability(x, n, p);
  }
  const np = n * p;
  const nq = n * (1 - p);
  const stirling = stirlingError(j) - stirlingError(x) + (stirlingError(n - j) - stirlingError(n - x));
  const deviance = devianceTerm(j, np) - devianceTerm(x, np) + (devianceTerm(n - j, nq) - devianceTerm(n - x, nq));
  const root = 0.5 * (Math.log1p((j - x) / x) + Math.log1p((x - j) / (n - x)));
  return -stirling - deviance - root;
}
