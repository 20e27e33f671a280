import { noncentralChiSquareTails } from '../distributions/noncentral-chi-square';
import { cohensWInterval } from './cohens-w-interval';
import { cohensW, effectSizeWord } from './cohens-w';
import { noncentralityInterval } from './noncentrality-interval';

describe("Cohen's w", () => {
  it('is √(X²/n) with the conventional words (Cohen 1988: .1 small, .3 medium, .5 large)', () => {
    expect(cohensW(9, 100)).toBeCloseTo(0.3, 15);
    expect(effectSizeWord(0.05)).toBe('negligible');
    expect(effectSizeWord(0.1)).toBe('small');
    expect(effectSizeWord(0.3)).toBe('medium');
    expect(effectSizeWord(0.5)).toBe('large');
  });

  it('has an interval whose limits invert the noncentral distribution (Steiger & Fouladi 1997)', () => {
    const statistic = 13.593;
    const df = 3;
    const { low, high } = noncentralityInterval(statistic, df, 0.95);
    expect(noncentralChiSquareTails(statistic, df, low).upper).toBeCloseTo(0.025, 9);
    expect(noncentralChiSquareTails(statistic, df, high).lower).toBeCloseTo(0.025, 9);
    const w = cohensWInterval(statistic, df, 156, 0.95);
    expect(w.low).toBeLessThan(cohensW(statistic, 156));
    expect(w.high).toBeGreaterThan(cohensW(statistic, 156));
    expect(w.level).toBe(0.95);
  });

  it('puts the lower limit at 0 when the statistic is below the 97.5% point, and both at 0 below the 2.5% point', () => {
    expect(noncentralityInterval(2, 3, 0.95).low).toBe(0);
    expect(noncentralityInterval(2, 3, 0.95).high).toBeGreaterThan(0);
    expect(noncentralityInterval(0.1, 3, 0.95)).toEqual({ low: 0, high: 0 });
  });

  it('widens with the level', () => {
    const narrow = noncentralityInterval(20, 4, 0.8);
    const wide = noncentralityInterval(20, 4, 0.99);
    expect(wide.low).toBeLessThan(narrow.low);
    expect(wide.high).toBeGreaterThan(narrow.high);
  });
});
