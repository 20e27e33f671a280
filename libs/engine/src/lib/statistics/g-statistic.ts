/**
 * The likelihood-ratio statistic G = 2 Σ O ln(O / E) (Wilks 1938; Sokal & Rohlf, Biometry,
 * chapter 17), with 0 ln 0 = 0. Rounded to 0 when the sum is a negative rounding residue.
 */
export function gStatistic(observed: readonly number[], expected: readonly number[]): number {
  let sum = 0;
  for (let i = 0; i < observed.length; i++) {
    const o = observed[i];
    if (o > 0) sum += o * Math.log(o / expected[i]);
  }
  return Math.max(0, 2 * sum);
}

/**
 * Williams' (1976) correction q = 1 + (k² − 1) / (6 n ν) for a goodness-of-fit G-test with k
 * categories, n observations and ν degrees of freedom (Sokal & Rohlf, Biometry, section 17.2);
 * with no estimated parameters ν = k − 1 and q = 1 + (k + 1) / (6n). The corrected statistic is G / q.
 */
export function williamsCorrection(k: number, n: number, df: number): number {
  return 1 + (k * k - 1) / (6 * n * df);
}
