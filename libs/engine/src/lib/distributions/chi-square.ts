/**
 * The central chi-square distribution with df > 0 degrees of freedom: upper and lower tails with
 * their logarithms, the density and quantiles.
 *
 * Tails: X ~ χ²(df) has P(X > x) = Q(df/2, x/2), the upper regularised incomplete gamma
 * function, computed directly (never as 1 − P) — see ../special/incomplete-gamma.ts.
 */
import { regularizedGammaTails } from '../special/incomplete-gamma';
import { logGamma } from '../special/log-gamma';

export interface ChiSquareTails {
  /** P(X > x) */
  upper: number;
  /** ln P(X > x); finite even where `upper` underflows to 0 */
  logUpper: number;
  /** P(X <= x) */
  lower: number;
  /** ln P(X <= x) */
  logLower: number;
}

function checkDegreesOfFreedom(df: number): void {
  if (!(df > 0) || !Number.isFinite(df)) {
    throw new RangeError(`degrees of freedom must be a positive finite number, got ${df}`);
  }
}

function checkStatistic(x: number): void {
  if (Number.isNaN(x)) throw new RangeError('x must be a number, got NaN');
}

/** Both tails of χ²(df) at x (x <= 0 gives upper = 1). */
export function chiSquareTails(x: number, df: number): ChiSquareTails {
  checkDegreesOfFreedom(df);
  checkStatistic(x);
  if (x <= 0) return { upper: 1, logUpper: 0, lower: 0, logLower: -Infinity };
  const tails = regularizedGammaTails(df / 2, x / 2);
  return { upper: tails.upper, logUpper: tails.logUpper, lower: tails.lower, logLower: tails.logLower };
}

/** P(X > x) for X ~ χ²(df): the p-value of a chi-square statistic x. */
export function chiSquareSurvival(x: number, df: number): number {
  return chiSquareTails(x, df).upper;
}

/** ln P(X > x), accurate where the p-value itself underflows. */
export function chiSquareLogSurvival(x: number, df: number): number {
  return chiSquareTails(x, df).logUpper;
}

/** P(X <= x). */
export function chiSquareCdf(x: number, df: number): number {
  return chiSquareTails(x, df).lower;
}

/** ln P(X <= x). */
export function chiSquareLogCdf(x: number, df: number): number {
  return chiSquareTails(x, df).logLower;
}

/** ln of the density of χ²(df) at x > 0. */
export function chiSquareLogDensity(x: number, df: number): number {
  checkDegreesOfFreedom(df);
  if (x < 0) return -Infinity;
  const a = df / 2;
  if (x === 0) return a < 1 ? Infinity : a === 1 ? -Math.LN2 : -Infinity;
  return (a - 1) * Math.log(x / 2) - x / 2 - logGamma(a) - Math.LN2;
}

/**
 * Solve ln T(x) = logTarget for x, where T is the upper tail (decreasing) or the lower tail
 * (increasing) of χ²(df). Newton steps on the log scale, kept inside a bracket that halves
 * whenever a step would leave it; stops when the step is below 1e-15 relative.
 */
function solveTail(logTarget: number, df: number, tail: 'upper' | 'lower'): number {
  const logTail = (x: number): number => {
    const tails = chiSquareTails(x, df);
    return tail === 'upper' ? tails.logUpper : tails.logLower;
  };
  // residual > 0 means x is too small.
  const residual = (x: number): number => (tail === 'upper' ? logTail(x) - logTarget : logTarget - logTail(x));
  let low = 0;
  let high = Math.max(df, 1);
  while (residual(high) > 0) {
    low = high;
    high *= 2;
  }
  let x = high;
  if (low === 0) {
    // Bisect geometrically towards 0 until the root is bracketed away from the pole.
    let probe = high / 2;
    while (probe > 1e-300 && residual(probe) <= 0) {
      high = probe;
      probe /= 2;
    }
    low = probe > 1e-300 ? probe : 0;
    x = high;
  }
  for (let iteration = 0; iteration < 300; iteration++) {
    const r = residual(x);
    if (r === 0) return x;
    if (r > 0) low = x;
    else high = x;
    const tails = chiSquareTails(x, df);
    const logTailValue = tail === 'upper' ? tails.logUpper : tails.logLower;
    // d/dx ln T = ∓ f(x) / T(x)
    const slope = Math.exp(chiSquareLogDensity(x, df) - logTailValue);
    let next = x + (tail === 'upper' ? r / slope : r / slope);
    if (!(next > low && next < high) || !Number.isFinite(next)) next = low === 0 ? high / 2 : (low + high) / 2;
    if (Math.abs(next - x) <= 1e-15 * Math.abs(x)) return next;
    if (high - low <= 1e-15 * high) return next;
    x = next;
  }
  return x;
}

/** The value x with P(X <= x) = probability (the lower-tail quantile). */
export function chiSquareQuantile(probability: number, df: number): number {
  checkDegreesOfFreedom(df);
  if (!(probability >= 0 && probability <= 1)) {
    throw new RangeError(`probability must be in [0, 1], got ${probability}`);
  }
  if (probability === 0) return 0;
  if (probability === 1) return Infinity;
  return probability <= 0.5
    ? solveTail(Math.log(probability), df, 'lower')
    : solveTail(Math.log1p(-probability), df, 'upper');
}

/** The critical value x with P(X > x) = alpha (the upper-tail quantile), without forming 1 − alpha. */
export function chiSquareCriticalValue(alpha: number, df: number): number {
  checkDegreesOfFreedom(df);
  if (!(alpha >= 0 && alpha <= 1)) throw new RangeError(`alpha must be in [0, 1], got ${alpha}`);
  if (alpha === 0) return Infinity;
  if (alpha === 1) return 0;
  return alpha <= 0.5
    ? solveTail(Math.log(alpha), df, 'upper')
    : solveTail(Math.log1p(-alpha), df, 'lower');
}
