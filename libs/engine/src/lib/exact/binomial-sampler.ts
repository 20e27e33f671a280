/**
 * Binomial random variates.
 *
 * - Mean below 10: inversion by sequential search from 0 (Kachitvichyanukul & Schmeiser 1988,
 *   "Binomial random variate generation", Commun. ACM 31:216–222, algorithm BINV).
 * - Otherwise: BTRS, transformed rejection with squeeze (Hörmann 1993, "The generation of binomial
 *   random variates", J. Statist. Comput. Simul. 46:101–110), which needs about 1.15 uniforms per
 *   variate and accepts most draws without evaluating a logarithm. The exact acceptance test
 *   compares with the binomial log-probability ratio, evaluated with Loader's saddle-point form.
 *
 * p > 1/2 is sampled as n minus a Binomial(n, 1 − p) variate so both methods see p ≤ 1/2.
 */
import { binomialLogProbability } from '../binomial/binomial-log-probability';
import { RandomSource } from './random-source';

const INVERSION_MEAN_LIMIT = 10;

export function sampleBinomial(random: RandomSource, n: number, p: number): number {
  if (n <= 0 || p <= 0) return 0;
  if (p >= 1) return n;
  if (p > 0.5) return n - sampleBinomial(random, n, 1 - p);
  if (n * p < INVERSION_MEAN_LIMIT) return inversion(random, n, p);
  return transformedRejection(random, n, p);
}

function inversion(random: RandomSource, n: number, p: number): number {
  const q = 1 - p;
  const odds = p / q;
  const a = (n + 1) * odds;
  let probability = Math.exp(n * Math.log1p(-p));
  let u = random.nextDouble();
  let x = 0;
  while (u > probability) {
    u -= probability;
    x++;
    if (x > n) {
      // Rounding left u marginally above the total mass: start over.
      u = random.nextDouble();
      x = 0;
      probability = Math.exp(n * Math.log1p(-p));
      continue;
    }
    probability *= a / x - odds;
  }
  return x;
}

function transformedRejection(random: RandomSource, n: number, p: number): number {
  const q = 1 - p;
  const spq = Math.sqrt(n * p * q);
  const b = 1.15 + 2.53 * spq;
  const a = -0.0873 + 0.0248 * b + 0.01 * p;
  const c = n * p + 0.5;
  const vr = 0.92 - 4.2 / b;
  const alpha = (2.83 + 5.1 / b) * spq;
  const mode = Math.floor((n + 1) * p);
  const logModeProbability = binomialLogProbability(mode, n, p);
  for (;;) {
    const u = random.nextDouble() - 0.5;
    let v = random.nextDouble();
    const us = 0.5 - Math.abs(u);
    const k = Math.floor(((2 * a) / us + b) * u + c);
    if (k < 0 || k > n) continue;
    if (us >= 0.07 && v <= vr) return k;
    v = Math.log((v * alpha) / (a / (us * us) + b));
    if (v <= binomialLogProbability(k, n, p) - logModeProbability) return k;
  }
}
