/**
 * Regularised incomplete gamma functions P(a, x) (lower) and Q(a, x) = 1 − P(a, x) (upper),
 * with their logarithms.
 *
 * Method (Numerical Recipes, Press et al. 2007, §6.2): the power series for P when x < a + 1 and
 * the continued fraction for Q (evaluated by the modified Lentz algorithm, Lentz 1976;
 * Thompson & Barnett 1986) otherwise. Each branch computes the tail that is small in its region
 * directly, and the other tail as a complement of a number no larger than about 0.92, so neither
 * loses more than a digit. The common prefactor x^a e^{−x} / Γ(a + 1) comes from Loader's
 * saddle-point form (see poisson-density.ts), which keeps ~1e-13 relative accuracy even for
 * large a; in the far tail the log of the result stays finite long after the value underflows.
 * Both iterations stop on a convergence test, not a fixed count; they need O(√a) steps near x ≈ a.
 */
import { logPoissonDensity } from './poisson-density';

export interface GammaTails {
  lower: number;
  upper: number;
  logLower: number;
  logUpper: number;
}

const RELATIVE_TOLERANCE = 1e-16;
const TINY = 1e-300;

function maxIterations(a: number): number {
  return 2000 + Math.ceil(200 * Math.sqrt(a));
}

/** Σ_{n>=0} x^n / ((a + 1)(a + 2)…(a + n)): P(a, x) = that sum × x^a e^{−x} / Γ(a + 1). */
function lowerSeries(a: number, x: number): number {
  let term = 1;
  let sum = 1;
  const limit = maxIterations(a) + Math.ceil(4 * x);
  for (let n = 1; n < limit; n++) {
    term *= x / (a + n);
    sum += term;
    if (term < sum * RELATIVE_TOLERANCE) break;
  }
  return sum;
}

/** Continued fraction h with Q(a, x) = h × x^a e^{−x} / Γ(a), by modified Lentz. */
function upperContinuedFraction(a: number, x: number): number {
  let b = x + 1 - a;
  let c = 1 / TINY;
  let d = 1 / b;
  let h = d;
  const limit = maxIterations(a);
  for (let i = 1; i < limit; i++) {
    const an = -i * (i - a);
    b += 2;
    d = an * d + b;
    if (Math.abs(d) < TINY) d = TINY;
    c = b + an / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    const delta = d * c;
    h *= delta;
    if (Math.abs(delta - 1) < RELATIVE_TOLERANCE * 4) break;
  }
  return h;
}

/** Both regularised tails of the gamma distribution with shape a > 0 at x >= 0. */
export function regularizedGammaTails(a: number, x: number): GammaTails {
  if (!(a > 0) || !Number.isFinite(a)) throw new RangeError(`shape must be positive and finite, got ${a}`);
  if (!(x >= 0)) throw new RangeError(`x must be >= 0, got ${x}`);
  if (x === 0) return { lower: 0, upper: 1, logLower: -Infinity, logUpper: 0 };
  if (x === Infinity) return { lower: 1, upper: 0, logLower: 0, logUpper: -Infinity };
  const logPrefactor = logPoissonDensity(a, x); // ln(x^a e^{-x} / Γ(a + 1))
  if (x < a + 1) {
    const logLower = logPrefactor + Math.log(lowerSeries(a, x));
    const lower = Math.exp(logLower);
    const upper = -Math.expm1(logLower);
    return { lower, upper, logLower, logUpper: Math.log1p(-lower) };
  }
  // x^a e^{-x} / Γ(a) = a × x^a e^{-x} / Γ(a + 1)
  const logUpper = Math.log(a) + logPrefactor + Math.log(upperContinuedFraction(a, x));
  const upper = Math.exp(logUpper);
  return { lower: -Math.expm1(logUpper), upper, logLower: Math.log1p(-upper), logUpper };
}

/** Q(a, x), the upper regularised incomplete gamma function. */
export function regularizedGammaUpper(a: number, x: number): number {
  return regularizedGammaTails(a, x).upper;
}

/** P(a, x), the lower regularised incomplete gamma function. */
export function regularizedGammaLower(a: number, x: number): number {
  return regularizedGammaTails(a, x).lower;
}
