/**
 * Sison–Glaz simultaneous confidence intervals for multinomial shares (Sison & Glaz 1995,
 * JASA 90:366–369), as also set out by May & Johnson (1997) for multinomial proportions.
 *
 * ν(c) = P(nᵢ − c ≤ Xᵢ ≤ nᵢ + c for all i), X ~ Multinomial(n, p̂), is evaluated through Levin's
 * (1981, Ann. Statist. 9:1123) representation
 *   ν(c) = n! / (nⁿ e⁻ⁿ) · Πᵢ P(aᵢ ≤ Yᵢ ≤ bᵢ) · P(W = n),  Yᵢ ~ Poisson(nᵢ),
 * W the sum of the Yᵢ truncated to [aᵢ, bᵢ], with P(W = n) from the Edgeworth expansion that uses
 * the truncated variables' first four moments. The integer c with ν(c) < level <= ν(c + 1) is
 * found by bisection (ν rises with c), and the intervals are
 *   [p̂ᵢ − c/n, p̂ᵢ + (c + 2γ)/n], γ = (level − ν(c)) / (ν(c + 1) − ν(c)), cut to [0, 1].
 */
import { regularizedGammaTails } from '../special/incomplete-gamma';
import { logFactorial } from '../special/log-gamma';
import type { ShareInterval } from './score-intervals';

const LOG_SQRT_TWO_PI = 0.9189385332046727;

/** P(Y <= m) for Y ~ Poisson(λ). */
function poissonAtMost(m: number, lambda: number): number {
  if (m < 0) return 0;
  return regularizedGammaTails(m + 1, lambda).upper;
}

/** P(a <= Y <= b) for Y ~ Poisson(λ). */
function poissonBetween(a: number, b: number, lambda: number): number {
  if (b < a || b < 0) return 0;
  return Math.max(0, poissonAtMost(b, lambda) - poissonAtMost(a - 1, lambda));
}

interface TruncatedMoments {
  logProbability: number;
  mean: number;
  variance: number;
  third: number;
  fourth: number;
}

/**
 * Probability and central moments of Poisson(λ) truncated to [a, b], from the factorial moments
 * E[Z(Z−1)…(Z−r+1)] = λ^r P(a − r <= Y <= b − r) / P(a <= Y <= b).
 */
function truncatedPoissonMoments(a: number, b: number, lambda: number): TruncatedMoments {
  const probability = poissonBetween(a, b, lambda);
  const factorial = [1, 2, 3, 4].map((r) => (lambda ** r * poissonBetween(a - r, b - r, lambda)) / probability);
  const [f1, f2, f3, f4] = factorial;
  const m1 = f1;
  const m2 = f2 + f1;
  const m3 = f3 + 3 * f2 + f1;
  const m4 = f4 + 6 * f3 + 7 * f2 + f1;
  return {
    logProbability: Math.log(probability),
    mean: m1,
    variance: Math.max(0, m2 - m1 * m1),
    third: m3 - 3 * m1 * m2 + 2 * m1 ** 3,
    fourth: m4 - 4 * m1 * m3 + 6 * m1 * m1 * m2 - 3 * m1 ** 4,
  };
}

/** ν(c), the multinomial probability of the box [nᵢ − c, nᵢ + c]. */
export function sisonGlazCoverage(counts: readonly number[], c: number): number {
  const n = counts.reduce((sum, x) => sum + x, 0);
  let logProduct = 0;
  let mean = 0;
  let variance = 0;
  let third = 0;
  let excessFourth = 0;
  for (const x of counts) {
    const moments = truncatedPoissonMoments(Math.max(0, x - c), x + c, x);
    if (moments.logProbability === -Infinity) return 0;
    logProduct += moments.logProbability;
    mean += moments.mean;
    variance += moments.variance;
    third += moments.third;
    excessFourth += moments.fourth - 3 * moments.variance ** 2;
  }
  // c = 0: every truncated variable is fixed at its count, W = n surely, and ν is the
  // multinomial probability of the observed table itself.
  if (c === 0) return Math.min(1, Math.exp(logFactorial(n) - n * Math.log(n) + n + logProduct));
  const sd = Math.sqrt(variance);
  const z = (n - mean) / sd;
  const skew = third / (variance * sd);
  const kurtosis = excessFourth / (variance * variance);
  const z2 = z * z;
  const edgeworth =
    1 +
    (skew / 6) * (z2 * z - 3 * z) +
    (kurtosis / 24) * (z2 * z2 - 6 * z2 + 3) +
    ((skew * skew) / 72) * (z2 * z2 * z2 - 15 * z2 * z2 + 45 * z2 - 15);
  const logDensity = -0.5 * z2 - LOG_SQRT_TWO_PI - Math.log(sd);
  const value = Math.exp(logFactorial(n) - n * Math.log(n) + n + logProduct + logDensity) * edgeworth;
  return Math.min(1, Math.max(0, value));
}

export function sisonGlazIntervals(counts: readonly number[], level: number): ShareInterval[] {
  const n = counts.reduce((sum, x) => sum + x, 0);
  // Smallest c with ν(c) >= level, by bisection on [0, n].
  let below = 0;
  let atOrAbove = n;
  if (sisonGlazCoverage(counts, 0) >= level) atOrAbove = 0;
  while (atOrAbove - below > 1) {
    const middle = Math.floor((below + atOrAbove) / 2);
    if (sisonGlazCoverage(counts, middle) >= level) atOrAbove = middle;
    else below = middle;
  }
  const c = Math.max(0, atOrAbove - 1);
  const nuC = sisonGlazCoverage(counts, c);
  const nuNext = sisonGlazCoverage(counts, c + 1);
  const gamma = nuNext > nuC ? (level - nuC) / (nuNext - nuC) : 0;
  return counts.map((x) => ({
    low: Math.max(0, x / n - c / n),
    high: Math.min(1, x / n + (c + 2 * gamma) / n),
  }));
}
