/**
 * Pearson's X² = Σ (O − E)² / E (Pearson 1900). Cells with E = 0 must have O = 0 and add nothing.
 */
export function pearsonStatistic(observed: readonly number[], expected: readonly number[]): number {
  let statistic = 0;
  for (let i = 0; i < observed.length; i++) {
    const e = expected[i];
    if (e > 0) {
      const difference = observed[i] - e;
      statistic += (difference * difference) / e;
    }
  }
  return statistic;
}
