/**
 * General-purpose reference libraries used only in tests (devDependencies): jstat and
 * @stdlib/stats-base-dists-chisquare. jstat ships no type declarations, so the parts we use are
 * typed here.
 */
import { cdf as stdlibChiSquareCdfImpl, quantile as stdlibChiSquareQuantileImpl } from '@stdlib/stats-base-dists-chisquare';

interface JStat {
  gammaln(x: number): number;
  lowRegGamma(a: number, x: number): number;
  chisquare: { cdf(x: number, df: number): number; inv(p: number, df: number): number };
  normal: { cdf(x: number, mean: number, sd: number): number; inv(p: number, mean: number, sd: number): number };
  binomial: { pdf(k: number, n: number, p: number): number; cdf(k: number, n: number, p: number): number };
  poisson: { pdf(k: number, lambda: number): number; cdf(k: number, lambda: number): number };
}

export const jStat: JStat = require('jstat').jStat ?? require('jstat');

export const stdlibChiSquareCdf: (x: number, df: number) => number = stdlibChiSquareCdfImpl;
export const stdlibChiSquareQuantile: (p: number, df: number) => number = stdlibChiSquareQuantileImpl;
