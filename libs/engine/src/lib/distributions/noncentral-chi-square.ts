/**
 * The noncentral chi-square distribution χ²(df, λ) as a Poisson mixture of central ones:
 *   P(X > x) = Σ_j e^{−λ/2} (λ/2)^j / j! · Q(df/2 + j, x/2).
 * Following Benton & Krishnamoorthy (2003, Computational Statistics & Data Analysis 43:249) the
 * sum starts at the Poisson mode and runs outward until the Poisson tails left out are below
 * 1e-18 (bounded by the geometric series their weights are dominated by), so the work is
 * O(√λ) rather than O(λ). Unlike Ding (1992, Applied Statistics 41:478) the gamma tails are
 * advanced only by additions — Q(s + 1, y) = Q(s, y) + y^s e^{−y} / Γ(s + 1) upward and
 * P(s, y) = P(s + 1, y) + y^s e^{−y} / Γ(s + 1) downward — each term taken from Loader's
 * saddle-point density, so no cancellation occurs in either tail. Absolute error about 1e-15.
 */
import { regularizedGammaTails } from '../special/incomplete-gamma';
import { logPoissonDensity } from '../special/poisson-density';
import { chiSquareTails } from './chi-square';

const TAIL_MASS_LEFT_OUT = 1e-18;

export interface NoncentralTails {
  upper: number;
  lower: number;
}

/** Range of Poisson(μ) indices outside which the left-out mass is below TAIL_MASS_LEFT_OUT. */
function poissonSpan(mu: number): { first: number; last: number } {
  const mode = Math.floor(mu);
  let first = mode;
  while (first > 0) {
    const weight = Math.exp(logPoissonDensity(first - 1, mu));
    // Σ_{j < first} w_j <= w_{first−1} / (1 − (first − 1)/μ), the ratio w_{j−1}/w_j = j/μ falling.
    if (weight / (1 - (first - 1) / mu) < TAIL_MASS_LEFT_OUT) break;
    first--;
  }
  let last = mode;
  for (;;) {
    const weight = Math.exp(logPoissonDensity(last + 1, mu));
    const ratio = mu / (last + 2);
    if (ratio < 1 && weight / (1 - ratio) < TAIL_MASS_LEFT_OUT) break;
    last++;
  }
  return { first, last };
}

function checkArguments(df: number, noncentrality: number): void {
  if (!(df > 0) || !Number.isFinite(df)) throw new RangeError(`degrees of freedom must be positive and finite, got ${df}`);
  if (!(noncentrality >= 0) || !Number.isFinite(noncentrality)) {
    throw new RangeError(`noncentrality must be >= 0 and finite, got ${noncentrality}`);
  }
}

/** Both tails of χ²(df, λ) at x. */
export function noncentralChiSquareTails(x: number, df: number, noncentrality: number): NoncentralTails {
  checkArguments(df, noncentrality);
  if (Number.isNaN(x)) throw new RangeError('x must be a number, got NaN');
  if (noncentrality === 0) {
    const central = chiSquareTails(x, df);
    return { upper: central.upper, lower: central.lower };
  }
  if (x <= 0) return { upper: 1, lower: 0 };
  if (x === Infinity) return { upper: 0, lower: 1 };
  const mu = noncentrality / 2;
  const a = df / 2;
  const y = x / 2;
  const { first, last } = poissonSpan(mu);
  const gammaStep = (j: number) => Math.exp(logPoissonDensity(a + j, y)); // y^{a+j} e^{−y} / Γ(a + j + 1)
  const weight = (j: number) => Math.exp(logPoissonDensity(j, mu));

  let upper = 0;
  let q = regularizedGammaTails(a + first, y).upper;
  for (let j = first; j <= last; j++) {
    upper += weight(j) * q;
    q += gammaStep(j);
  }
  let lower = 0;
  let p = regularizedGammaTails(a + last, y).lower;
  for (let j = last; j >= first; j--) {
    lower += weight(j) * p;
    if (j > first) p += gammaStep(j - 1);
  }
  // Each sum is accurate relative to its own size; the larger tail is best taken as the
  // complement of the smaller, which removes the rounding of a long sum of weights near 1.
  return upper <= lower ? { upper, lower: 1 - upper } : { upper: 1 - lower, lower };
}

export function noncentralChiSquareSurvival(x: number, df: number, noncentrality: number): number {
  return noncentralChiSquareTails(x, df, noncentrality).upper;
}

export function noncentralChiSquareCdf(x: number, df: number, noncentrality: number): number {
  return noncentralChiSquareTails(x, df, noncentrality).lower;
}
