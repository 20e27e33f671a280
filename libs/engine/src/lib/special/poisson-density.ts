/**
 * Saddle-point evaluation of Poisson-type densities, after Loader (2000), "Fast and accurate
 * computation of binomial probabilities". Writing x^a e^{-x} / Γ(a + 1) as
 * exp(−δ(a) − D(a, x)) / √(2πa) avoids the catastrophic cancellation of
 * a ln x − x − ln Γ(a + 1) when a and x are large.
 */
import { logGamma, stirlingError } from './log-gamma';

const LOG_TWO_PI = 1.8378770664093453;

/**
 * Deviance term D(x, m) = x ln(x / m) + m − x ≥ 0 (Loader's bd0), computed by a series
 * when x is close to m so that no digits are lost.
 */
export function devianceTerm(x: number, m: number): number {
  if (x === 0) return m;
  if (Math.abs(x - m) < 0.1 * (x + m)) {
    const v = (x - m) / (x + m);
    let sum = (x - m) * v;
    let power = 2 * x * v;
    const vSquared = v * v;
    for (let j = 1; j < 1000; j++) {
      power *= vSquared;
      const next = sum + power / (2 * j + 1);
      if (next === sum) return next;
      sum = next;
    }
    return sum;
  }
  return x * Math.log(x / m) + m - x;
}

/**
 * ln( m^x e^{-m} / Γ(x + 1) ) for real x >= 0 and rate m >= 0: the Poisson log-probability
 * when x is an integer, and the prefactor of the incomplete gamma function otherwise.
 */
export function logPoissonDensity(x: number, m: number): number {
  if (m === 0) return x === 0 ? 0 : -Infinity;
  if (x === 0) return -m;
  if (x < 1) return x * Math.log(m) - m - logGamma(x + 1);
  return -stirlingError(x) - devianceTerm(x, m) - 0.5 * (LOG_TWO_PI + Math.log(x));
}
