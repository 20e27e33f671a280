/**
 * APA-style statistics lines, e.g. `χ²(3, N = 556) = 0.47, p = .925` (APA Publication Manual,
 * 7th ed., section 6.43), with p printed so that it agrees with the decision at alpha.
 */
import type { ExactTestResult } from '../result/analysis-result';
import type { ChiSquareTestResult } from '../statistics/chi-square-test';
import { formatPAt, formatStatistic, groupDigits } from './format-numbers';

export function pearsonLine(test: ChiSquareTestResult, n: number, alpha: number): string {
  return `χ²(${test.df}, N = ${groupDigits(n)}) = ${formatStatistic(test.statistic)}, ${formatPAt(test.p, alpha)}`;
}

export function gLine(test: ChiSquareTestResult, n: number, alpha: number, williamsQ?: number): string {
  const base = `G(${test.df}, N = ${groupDigits(n)}) = ${formatStatistic(test.statistic)}, ${formatPAt(test.p, alpha)}`;
  return williamsQ === undefined ? base : `${base} (Williams-corrected, q = ${williamsQ.toFixed(4)})`;
}

export function cressieReadLine(test: ChiSquareTestResult, n: number, lambda: number, alpha: number): string {
  const lambdaText = Math.abs(lambda - 2 / 3) < 1e-12 ? '2/3' : String(Number(lambda.toPrecision(4)));
  return `CR(${test.df}, N = ${groupDigits(n)}) = ${formatStatistic(test.statistic)}, ${formatPAt(test.p, alpha)} (λ = ${lambdaText})`;
}

export function exactLine(test: ExactTestResult, n: number, alpha: number): string {
  const name = test.method === 'binomial' ? 'exact binomial test' : 'exact multinomial test';
  const base = `${name}, N = ${groupDigits(n)}, ${formatPAt(test.p, alpha)}`;
  if (test.method === 'monte-carlo' && test.se !== undefined && test.samples !== undefined) {
    return `${base} (Monte Carlo, ${groupDigits(test.samples)} draws, SE = ${test.se.toPrecision(2)})`;
  }
  return base;
}
