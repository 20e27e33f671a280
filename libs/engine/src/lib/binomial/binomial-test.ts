/**
 * Two-sided exact binomial test: the p-value is the total probability of all outcomes no more
 * probable than the observed one (the "probability ordering" — the k = 2 case of the exact
 * multinomial test), with a relative tie tolerance of 1e-7 so that outcomes equal in exact
 * arithmetic count as ties.
 *
 * The p-value is the sum of two tails, each beyond the mode (the distribution is unimodal), found
 * by binomial-tail.ts with work that does not grow with n; the far boundary is found by a short
 * walk from the observed count's mirror image about the mode, then bisection, so it costs
 * O(log n). Tails are carried as logarithms, so ln p stays finite when p underflows.
 */
import { binomialLogProbability, binomialLogProbabilityRatio } from './binomial-log-probability';
import { logBinomialTail } from './binomial-tail';

export const TIE_TOLERANCE = 1e-7;

export interface BinomialTestResult {
  p: number;
  logP: number;
}

function logAddExp(a: number, b: number): number {
  if (a === -Infinity) return b;
  if (b === -Infinity) return a;
  const high = Math.max(a, b);
  return high + Math.log1p(Math.exp(-Math.abs(a - b)));
}

/**
 * The first j in [from, to] (moving away from the mode) with ln P(j) − ln P(x) <= threshold,
 * assuming ln P decreases along that direction; returns undefined when there is none. Starts from a
 * guess (the mirror image of the observed count about the mode, where the answer lies for a
 * symmetric distribution) and walks from there with the ratio recurrence; falls back to bisection
 * when the walk gets long, so the cost stays O(log n).
 */
function firstAtOrBelow(
  threshold: number,
  observed: number,
  from: number,
  to: number,
  guess: number,
  n: number,
  p: number,
): number | undefined {
  const relative = (j: number) => binomialLogProbabilityRatio(j, observed, n, p);
  const step = to >= from ? 1 : -1;
  if (relative(to) > threshold) return undefined;
  const clamp = (j: number) => (step === 1 ? Math.min(to, Math.max(from, j)) : Math.max(to, Math.min(from, j)));
  const logOdds = Math.log(p) - Math.log1p(-p);
  // ln P(j + step) − ln P(j)
  const logRatio = (j: number) => (step === 1 ? Math.log((n - j) / (j + 1)) + logOdds : Math.log(j / (n - j + 1)) - logOdds);
  let j = clamp(guess);
  let logP = relative(j);
  const WALK_LIMIT = 64;
  for (let walked = 0; walked < WALK_LIMIT; walked++) {
    if (logP > threshold) {
      if (j === to) return undefined;
      logP += logRatio(j);
      j += step;
    } else {
      if (j === from) return j;
      const previous = logP - logRatio(j - step);
      if (previous > threshold) return j;
      logP = previous;
      j -= step;
    }
  }
  // Bisection on [inside, outside] between the first value above and the first at or below.
  let inside = logP > threshold ? j : from;
  let outside = logP > threshold ? to : j;
  if (relative(inside) <= threshold) return inside;
  while (Math.abs(outside - inside) > 1) {
    const middle = step === 1 ? Math.floor((inside + outside) / 2) : Math.ceil((inside + outside) / 2);
    if (relative(middle) <= threshold) outside = middle;
    else inside = middle;
  }
  return outside;
}

/** Two-sided exact binomial test of x successes in n trials against success probability p. */
export function binomialTest(x: number, n: number, p: number): BinomialTestResult {
  if (!Number.isInteger(x) || !Number.isInteger(n) || x < 0 || x > n) {
    throw new RangeError(`need whole numbers 0 <= x <= n, got x = ${x}, n = ${n}`);
  }
  if (!(p >= 0 && p <= 1)) throw new RangeError(`p must be in [0, 1], got ${p}`);
  if (n === 0 || p === 0 || p === 1) {
    const logObserved = binomialLogProbability(x, n, p);
    return logObserved === -Infinity ? { p: 0, logP: -Infinity } : { p: 1, logP: 0 };
  }
  const mode = Math.min(n, Math.floor((n + 1) * p));
  const threshold = Math.log1p(TIE_TOLERANCE); // on ln P(j) − ln P(x)
  let logP: number;
  if (threshold >= binomialLogProbabilityRatio(mode, x, n, p)) {
    logP = 0; // the observed outcome is (tied with) the most probable one
  } else if (x < mode) {
    const upperStart = mode < n ? firstAtOrBelow(threshold, x, mode + 1, n, 2 * mode - x, n, p) : undefined;
    logP = logBinomialTail(x, n, p, 'lower');
    if (upperStart !== undefined) logP = logAddExp(logP, logBinomialTail(upperStart, n, p, 'upper'));
  } else {
    const lowerStart = mode > 0 ? firstAtOrBelow(threshold, x, mode - 1, 0, 2 * mode - x, n, p) : undefined;
    logP = logBinomialTail(x, n, p, 'upper');
    if (lowerStart !== undefined) logP = logAddExp(logP, logBinomialTail(lowerStart, n, p, 'lower'));
  }
  logP = Math.min(0, logP);
  return { p: Math.exp(logP), logP };
}
