/**
 * Confidence interval for Cohen's w: the noncentrality interval of the Pearson statistic
 * (see noncentrality-interval.ts) turned into w through λ = n w², i.e. w = √(λ / n)
 * (Cohen 1988, section 7.2; Smithson 2003, Confidence Intervals, chapter 5).
 *
 * The reported w is √(X² / n), and X² estimates λ + df, so when X² is small the inverted interval
 * can end below the reported w — and when X² is below the central γ-quantile no λ >= 0 satisfies
 * both conditions, leaving [0, 0]. The upper limit is therefore raised to at least X² (so the
 * interval always contains the w it is printed beside); a wider interval only raises its coverage.
 */
import { noncentralityInterval } from './noncentrality-interval';

export function cohensWInterval(
  pearsonStatistic: number,
  df: number,
  n: number,
  level: number,
): { low: number; high: number; level: number } {
  const lambda = noncentralityInterval(pearsonStatistic, df, level);
  const high = Math.max(lambda.high, pearsonStatistic);
  return { low: Math.sqrt(lambda.low / n), high: Math.sqrt(high / n), level };
}
