/**
 * Maximum-likelihood estimates from the unbinned frequencies (each category one value):
 * Poisson λ̂ = mean; binomial p̂ = mean / trials; geometric (failures before the first success)
 * p̂ = 1 / (1 + mean). Standard results, e.g. Johnson, Kemp & Kotz, Univariate Discrete
 * Distributions, 3rd ed. (2005), sections 3.8, 4.7.1 and 5.2.
 */
import { EngineInputError } from '../../spec/engine-input-error';
import type { CountedValue } from './counted-values';

export function sampleMean(values: readonly CountedValue[]): number {
  let n = 0;
  let total = 0;
  for (const { value, count } of values) {
    n += count;
    total += value * count;
  }
  return total / n;
}

export function estimatePoissonLambda(values: readonly CountedValue[]): number {
  const mean = sampleMean(values);
  if (!(mean > 0)) throw EngineInputError.at('hypothesis.params.lambda', 'lambda cannot be estimated: every observation is 0');
  return mean;
}

export function estimateBinomialP(values: readonly CountedValue[], trials: number): number {
  const p = sampleMean(values) / trials;
  if (!(p > 0 && p < 1)) {
    throw EngineInputError.at(
      'hypothesis.params.p',
      `p cannot be estimated: every observation is ${p <= 0 ? 0 : trials}, which leaves no variation to fit`,
    );
  }
  return p;
}

export function estimateGeometricP(values: readonly CountedValue[]): number {
  const mean = sampleMean(values);
  if (!(mean > 0)) throw EngineInputError.at('hypothesis.params.p', 'p cannot be estimated: every observation is 0');
  return 1 / (1 + mean);
}
