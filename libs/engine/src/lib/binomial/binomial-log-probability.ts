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
