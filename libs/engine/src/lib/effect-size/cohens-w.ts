/**
 * Cohen's w = √(Σ (p₁ − p₀)² / p₀) = √(X² / n) (Cohen 1988, Statistical Power Analysis for the
 * Behavioral Sciences, 2nd ed., chapter 7), with his conventional size words: 0.1 small,
 * 0.3 medium, 0.5 large; below 0.1 we say negligible (common practice, no source).
 */
import type { EffectSizeWord } from '../result/analysis-result';

export function cohensW(pearsonStatistic: number, n: number): number {
  return Math.sqrt(pearsonStatistic / n);
}

export function effectSizeWord(w: number): EffectSizeWord {
  if (w < 0.1) return 'negligible';
  if (w < 0.3) return 'small';
  if (w < 0.5) return 'medium';
  return 'large';
}
