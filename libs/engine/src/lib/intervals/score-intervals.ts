/**
 * Score-type intervals for multinomial shares. All share one form (Quesenberry & Hurst 1964,
 * Technometrics 6:191): for count x out of n and a chi-square critical value A,
 *   [A + 2x ∓ √(A (A + 4x(n − x)/n))] / (2(n + A)).
 * - Wilson (1927, JASA 22:209), one category at a time: A = χ²₁(1 − α) = z².
 * - Quesenberry–Hurst, simultaneous: A = χ²_{k−1}(1 − α).
 * - Goodman (1965, Technometrics 7:247), simultaneous via Bonferroni: A = χ²₁(1 − α/k).
 */
import { chiSquareCriticalValue } from '../distributions/chi-square';

export interface ShareInterval {
  low: number;
  high: number;
}

export function scoreInterval(x: number, n: number, criticalValue: number): ShareInterval {
  const a = criticalValue;
  const centre = a + 2 * x;
  const halfWidth = Math.sqrt(a * (a + (4 * x * (n - x)) / n));
  const denominator = 2 * (n + a);
  // At x = 0 and x = n the bounds are exactly 0 and 1; form them without rounding residue.
  const low = x === 0 ? 0 : Math.max(0, (centre - halfWidth) / denominator);
  const high = x === n ? 1 : Math.min(1, (centre + halfWidth) / denominator);
  return { low, high };
}

export function wilsonIntervals(counts: readonly number[], level: number): ShareInterval[] {
  const n = counts.reduce((sum, c) => sum + c, 0);
  const a = chiSquareCriticalValue(1 - level, 1);
  return counts.map((x) => scoreInterval(x, n, a));
}

export function quesenberryHurstIntervals(counts: readonly number[], level: number): ShareInterval[] {
  const n = counts.reduce((sum, c) => sum + c, 0);
  const a = chiSquareCriticalValue(1 - level, counts.length - 1);
  return counts.map((x) => scoreInterval(x, n, a));
}

export function goodmanIntervals(counts: readonly number[], level: number): ShareInterval[] {
  const n = counts.reduce((sum, c) => sum + c, 0);
  const a = chiSquareCriticalValue((1 - level) / counts.length, 1);
  return counts.map((x) => scoreInterval(x, n, a));
}
