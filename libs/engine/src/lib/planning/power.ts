/**
 * Power and sample size for a chi-square goodness-of-fit test with effect size w (Cohen 1988,
 * Statistical Power Analysis for the Behavioral Sciences, 2nd ed., chapter 7): under the
 * alternative the Pearson statistic is approximately noncentral χ²(df, λ) with λ = n w², so
 *   power = P(χ²(df, n w²) > c), c the upper-α critical value of the central χ²(df).
 */
import { chiSquareCriticalValue } from '../distributions/chi-square';
import { noncentralChiSquareTails } from '../distributions/noncentral-chi-square';
import { findRoot } from '../optimize/find-root';
import { EngineInputError } from '../spec/engine-input-error';

export interface PowerInput {
  /** Cohen's w, > 0 */
  w: number;
  /** degrees of freedom, a whole number >= 1 */
  df: number;
  /** sample size, > 0 */
  n: number;
  /** significance level, default 0.05 */
  alpha?: number;
}

export interface PowerResult {
  power: number;
  criticalValue: number;
  /** noncentrality λ = n w² */
  ncp: number;
}

export interface SampleSizeInput {
  w: number;
  df: number;
  /** target power, in (alpha, 1) */
  power: number;
  alpha?: number;
}

export interface SampleSizeResult {
  /** smallest whole n whose power reaches the target */
  n: number;
  /** n solving power(n) = target exactly */
  nContinuous: number;
  /** the power reached at n */
  power: number;
}

function checkPositive(value: number, field: string): void {
  if (typeof value !== 'number' || !Number.isFinite(value) || !(value > 0)) {
    throw EngineInputError.at(field, `${field} must be a positive finite number, got ${String(value)}`);
  }
}

function checkCommon(w: number, df: number, alpha: number): void {
  checkPositive(w, 'w');
  if (!Number.isInteger(df) || df < 1) throw EngineInputError.at('df', `df must be a whole number >= 1, got ${String(df)}`);
  if (!(typeof alpha === 'number' && alpha > 0 && alpha < 1)) {
    throw EngineInputError.at('alpha', `alpha must be between 0 and 1, got ${String(alpha)}`);
  }
}

export function power(input: PowerInput): PowerResult {
  const alpha = input.alpha ?? 0.05;
  checkCommon(input.w, input.df, alpha);
  checkPositive(input.n, 'n');
  const criticalValue = chiSquareCriticalValue(alpha, input.df);
  const ncp = input.n * input.w * input.w;
  return { power: noncentralChiSquareTails(criticalValue, input.df, ncp).upper, criticalValue, ncp };
}

export function sampleSize(input: SampleSizeInput): SampleSizeResult {
  const alpha = input.alpha ?? 0.05;
  checkCommon(input.w, input.df, alpha);
  if (!(typeof input.power === 'number' && input.power > alpha && input.power < 1)) {
    throw EngineInputError.at('power', `power must be above alpha (${alpha}) and below 1, got ${String(input.power)}`);
  }
  const criticalValue = chiSquareCriticalValue(alpha, input.df);
  const shortfall = (ncp: number) => input.power - noncentralChiSquareTails(criticalValue, input.df, ncp).upper;
  let high = Math.max(1, criticalValue);
  while (shortfall(high) > 0) high *= 2;
  const ncp = findRoot(shortfall, 0, high, 1e-14);
  const nContinuous = ncp / (input.w * input.w);
  let n = Math.max(1, Math.ceil(nContinuous));
  // Guard the rounding at the boundary: step to the first whole n that reaches the target.
  while (n > 1 && power({ w: input.w, df: input.df, n: n - 1, alpha }).power >= input.power) n--;
  let reached = power({ w: input.w, df: input.df, n, alpha }).power;
  while (reached < input.power) {
    n++;
    reached = power({ w: input.w, df: input.df, n, alpha }).power;
  }
  return { n, nContinuous, power: reached };
}
