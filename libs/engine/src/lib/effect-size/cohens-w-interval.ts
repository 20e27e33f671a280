/**
 * Confidence interval for Cohen's w: the noncentrality interval of the Pearson statistic
 * (see noncentrality-interval.ts) turned into w through λ = n w², i.e. w = √(λ / n)
 * (Cohen 1988, section 7.2; Smithson 2003, Confidence Intervals, chapter 5).
 */
import { noncentralityInterval } from './noncentrality-interval';

export function cohensWInterval(
  pearsonStatistic: number,
  df: number,
  n: number,
  level: number,
): { low: number; high: number; level: number } {
  const lambda = noncentralityInterval(pearsonStatistic, df, level);
  return { low: Math.sqrt(lambda.low / n), high: Math.sqrt(lambda.high / n), level };
}
