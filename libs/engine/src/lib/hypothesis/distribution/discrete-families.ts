/**
 * The counted-value families: Poisson, binomial, geometric, discrete uniform and Benford's
 * first-digit law. Tails are computed directly as tails (no 1 − cdf where it would cancel).
 */
import { binomialLogProbability } from '../../binomial/binomial-log-probability';
import { regularizedGammaTails } from '../../special/incomplete-gamma';
import { logPoissonDensity } from '../../special/poisson-density';
import type { DiscreteFamily } from './discrete-family';

function formatParameter(value: number): string {
  return String(Number(value.toPrecision(4)));
}

/** Poisson(λ): P(X <= v) = Q(v + 1, λ) and P(X >= v) = P(v, λ), the regularised incomplete gamma functions. */
export function poissonFamily(lambda: number): DiscreteFamily {
  return {
    description: `a Poisson distribution with λ = ${formatParameter(lambda)}`,
    supportMin: 0,
    supportMax: Infinity,
    probability: (v) => Math.exp(logPoissonDensity(v, lambda)),
    atMost: (v) => regularizedGammaTails(v + 1, lambda).upper,
    atLeast: (v) => (v <= 0 ? 1 : regularizedGammaTails(v, lambda).lower),
  };
}

/** Binomial(trials, p); tails summed from the end of the support, whichever side is shorter. */
export function binomialFamily(trials: number, p: number): DiscreteFamily {
  const probability = (v: number) => Math.exp(binomialLogProbability(v, trials, p));
  const sumRange = (from: number, to: number) => {
    let total = 0;
    for (let v = from; v <= to; v++) total += probability(v);
    return Math.min(1, total);
  };
  return {
    description: `a binomial distribution with ${trials} trials and p = ${formatParameter(p)}`,
    supportMin: 0,
    supportMax: trials,
    probability,
    atMost: (v) => (v >= trials ? 1 : sumRange(0, v)),
    atLeast: (v) => (v <= 0 ? 1 : sumRange(v, trials)),
  };
}

/** Geometric: the number of failures before the first success, P(X = v) = p (1 − p)^v, v = 0, 1, … */
export function geometricFamily(p: number): DiscreteFamily {
  const logFailure = Math.log1p(-p);
  return {
    description: `a geometric distribution (failures before the first success) with p = ${formatParameter(p)}`,
    supportMin: 0,
    supportMax: Infinity,
    probability: (v) => p * Math.exp(v * logFailure),
    atMost: (v) => -Math.expm1((v + 1) * logFailure),
    atLeast: (v) => (v <= 0 ? 1 : Math.exp(v * logFailure)),
  };
}

/** Equal chances for every whole number from min to max. */
export function discreteUniformFamily(min: number, max: number): DiscreteFamily {
  const size = max - min + 1;
  return {
    description: `equal chances for every whole number from ${min} to ${max}`,
    supportMin: min,
    supportMax: max,
    probability: (v) => (v >= min && v <= max ? 1 / size : 0),
    atMost: (v) => Math.min(1, Math.max(0, (v - min + 1) / size)),
    atLeast: (v) => Math.min(1, Math.max(0, (max - v + 1) / size)),
  };
}

/**
 * Benford's law for first digits (Newcomb 1881; Benford 1938, Proc. Am. Philos. Soc. 78:551):
 * P(D = d) = log10(1 + 1/d), d = 1…9, so P(D <= d) = log10(d + 1) and P(D >= d) = 1 − log10(d).
 */
export function benfordFamily(): DiscreteFamily {
  return {
    description: "Benford's law for first digits",
    supportMin: 1,
    supportMax: 9,
    probability: (d) => (d >= 1 && d <= 9 ? Math.log10(1 + 1 / d) : 0),
    atMost: (d) => (d >= 9 ? 1 : d < 1 ? 0 : Math.log10(d + 1)),
    atLeast: (d) => (d <= 1 ? 1 : d > 9 ? 0 : 1 - Math.log10(d)),
  };
}
