/**
 * Binomial tails beyond the mode (the tail that is small), with work that does not grow with n.
 * P(X >= y) = I_p(y, n − y + 1), the regularised incomplete beta function (Abramowitz & Stegun
 * 1964, 26.5.24), computed by whichever of three routes is
 * cheap and accurate where the arguments fall (the split follows DiDonato & Morris 1992, ACM TOMS
 * 18:360, "Algorithm 708"):
 * - the terms themselves, when the tail is short (n − y < 100) or falls off quickly (the first
 *   ratio P(y + 1)/P(y) is at most 0.9, so under 450 terms reach 1e-19 of the first);
 * - the asymptotic expansion (incomplete-beta-asymptotic.ts) when y and n − y + 1 are both at
 *   least 100 and λ = y − (n + 1)p is at most 3% of the smaller;
 * - the continued fraction (incomplete-beta-continued-fraction.ts) otherwise, with the prefactor
 *   x^a (1 − x)^b / (a B(a, b)) = P(X = y)(1 − p) taken from Loader's saddle-point binomial term.
 */
import { logIncompleteBetaAsymptotic } from '../special/incomplete-beta-asymptotic';
import { incompleteBetaContinuedFraction } from '../special/incomplete-beta-continued-fraction';
import { binomialLogProbability } from './binomial-log-probability';

const SHORT_TAIL = 100;
const FAST_FALL_RATIO = 0.9;
const ASYMPTOTIC_MIN_PARAMETER = 100;
const ASYMPTOTIC_MAX_LAMBDA_SHARE = 0.03;

/**
 * ln of the tail sum starting at `start` and running away from the mode in `direction`, adding
 * the terms one by one with the ratio P(j + 1)/P(j) = (n − j) p / ((j + 1) q) (or its inverse).
 */
function logTermSum(start: number, direction: 1 | -1, n: number, p: number): number {
  const logFirst = binomialLogProbability(start, n, p);
  if (logFirst === -Infinity) return -Infinity;
  const odds = p / (1 - p);
  let term = 1;
  let sum = 1;
  for (let j = start; direction === 1 ? j < n : j > 0; j += direction) {
    term *= direction === 1 ? ((n - j) / (j + 1)) * odds : j / (n - j + 1) / odds;
    const next = sum + term;
    if (next === sum) break;
    sum = next;
  }
  return logFirst + Math.log(sum);
}

/**
 * ln P(X >= count) (side `upper`) or ln P(X <= count) (side `lower`) for X ~ Binomial(n, p) with
 * 0 < p < 1, when count lies at or beyond the mode on that side. The lower tail is the upper tail
 * of n − X ~ Binomial(n, 1 − p), written out here so that p is never recovered as 1 − (1 − p).
 */
export function logBinomialTail(count: number, n: number, p: number, side: 'upper' | 'lower'): number {
  const direction = side === 'upper' ? 1 : -1;
  if (side === 'upper' ? count <= 0 : count >= n) return 0;
  if (side === 'upper' ? count > n : count < 0) return -Infinity;
  // In beta terms the tail is I_x(a, b) with λ = a − (a + b) x.
  const a = side === 'upper' ? count : n - count;
  const b = n - a + 1;
  const lambda = side === 'upper' ? count - (n + 1) * p : (n + 1) * p - (count + 1);
  const odds = p / (1 - p);
  const firstRatio = side === 'upper' ? ((n - count) / (count + 1)) * odds : count / (n - count + 1) / odds;
  if (b <= SHORT_TAIL || firstRatio <= FAST_FALL_RATIO) return logTermSum(count, direction, n, p);
  const smaller = Math.min(a, b);
  if (smaller >= ASYMPTOTIC_MIN_PARAMETER && lambda >= 0 && lambda <= ASYMPTOTIC_MAX_LAMBDA_SHARE * smaller) {
    return logIncompleteBetaAsymptotic(a, b, lambda);
  }
  // x^a (1 − x)^b / (a B(a, b)) = P(X = count) × (q for the upper tail, p for the lower).
  const logOtherShare = side === 'upper' ? Math.log1p(-p) : Math.log(p);
  const x = side === 'upper' ? p : 1 - p;
  return binomialLogProbability(count, n, p) + logOtherShare + Math.log(incompleteBetaContinuedFraction(a, b, x));
}
