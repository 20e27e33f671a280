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
  const modeWeight = Math.exp(logPoissonDensity(mode, mu));
  // Walk down: w_{j−1} = w_j j / μ. The left-out mass below `first` is at most
  // w_{first−1} / (1 − (first − 1)/μ), the ratios falling geometrically.
  let first = mode;
  let weight = modeWeight;
  while (first > 0) {
    const below = (weight * first) / mu;
    if (below / (1 - (first - 1) / mu) < TAIL_MASS_LEFT_OUT) break;
    weight = below;
    first--;
  }
  // Walk up: w_{j+1} = w_j μ / (j + 1), bounded likewise once the ratio is below 1.
  let last = mode;
  weight = modeWeight;
  for (;;) {
    const above = (weight * mu) / (last + 1);
    const ratio = mu / (last + 2);
    if (ratio < 1 && above / (1 - ratio) < TAIL_MASS_LEFT_OUT) break;
    weight = above;
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
interface MixtureSetup {
  mu: number;
  a: number;
  y: number;
  first: number;
  last: number;
}

// Terms advance by their ratios — weight_{j+1} = weight_j μ/(j + 1) and
// step_{j+1} = step_j y/(a + j + 1) — and are recomputed directly whenever they are so small
// that the ratio recurrence could have lost them to underflow.
const REANCHOR_BELOW = 1e-250;

/** Σ_j w_j Q(a + j, y), with Q advanced upward by additions. */
function upperSum({ mu, a, y, first, last }: MixtureSetup): number {
  const directWeight = (j: number) => Math.exp(logPoissonDensity(j, mu));
  const directStep = (j: number) => Math.exp(logPoissonDensity(a + j, y)); // y^{a+j} e^{−y} / Γ(a + j + 1)
  let upper = 0;
  let q = regularizedGammaTails(a + first, y).upper;
  let weight = directWeight(first);
  let step = directStep(first);
  for (let j = first; j <= last; j++) {
    upper += weight * q;
    q += step; // Q(a + j + 1, y) = Q(a + j, y) + y^{a+j} e^{−y} / Γ(a + j + 1)
    weight = weight < REANCHOR_BELOW ? directWeight(j + 1) : (weight * mu) / (j + 1);
    step = step < REANCHOR_BELOW ? directStep(j + 1) : (step * y) / (a + j + 1);
  }
  return upper;
}

/** Σ_j w_j P(a + j, y), with P advanced downward by additions. */
function lowerSum({ mu, a, y, first, last }: MixtureSetup): number {
  const directWeight = (j: number) => Math.exp(logPoissonDensity(j, mu));
  const directStep = (j: number) => Math.exp(logPoissonDensity(a + j, y));
  let lower = 0;
  let p = regularizedGammaTails(a + last, y).lower;
  let weight = directWeight(last);
  let step = last > first ? directStep(last - 1) : 0;
  for (let j = last; j >= first; j--) {
    lower += weight * p;
    if (j === first) break;
    p += step; // P(a + j − 1, y) = P(a + j, y) + y^{a+j−1} e^{−y} / Γ(a + j)
    weight = weight < REANCHOR_BELOW ? directWeight(j - 1) : (weight * j) / mu;
    if (j - 2 < first) step = 0;
    else step = step < REANCHOR_BELOW ? directStep(j - 2) : (step * (a + j - 1)) / y;
  }
  return lower;
}

function setup(x: number, df: number, noncentrality: number): MixtureSetup {
  const mu = noncentrality / 2;
  return { mu, a: df / 2, y: x / 2, ...poissonSpan(mu) };
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
  const mixture = setup(x, df, noncentrality);
  const upper = upperSum(mixture);
  const lower = lowerSum(mixture);
  // Each sum is accurate relative to its own size; the larger tail is best taken as the
  // complement of the smaller, which removes the rounding of a long sum of weights near 1.
  return upper <= lower ? { upper, lower: 1 - upper } : { upper: 1 - lower, lower };
}

/**
 * One tail of χ²(df, λ) at x, computed directly (half the work of `noncentralChiSquareTails`);
 * absolute error about 1e-15, so meant for tail values that are not close to 1.
 */
export function noncentralChiSquareTail(x: number, df: number, noncentrality: number, tail: 'upper' | 'lower'): number {
  checkArguments(df, noncentrality);
  if (noncentrality === 0 || x <= 0 || x === Infinity) {
    const both = noncentralChiSquareTails(x, df, noncentrality);
    return tail === 'upper' ? both.upper : both.lower;
  }
  const mixture = setup(x, df, noncentrality);
  return Math.min(1, tail === 'upper' ? upperSum(mixture) : lowerSum(mixture));
}

export function noncentralChiSquareSurvival(x: number, df: number, noncentrality: number): number {
  return noncentralChiSquareTails(x, df, noncentrality).upper;
}

export function noncentralChiSquareCdf(x: number, df: number, noncentrality: number): number {
  return noncentralChiSquareTails(x, df, noncentrality).lower;
}
