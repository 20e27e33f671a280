import { expectClose } from '../../testing/expect-close';
import { readFixture } from '../../testing/reference-fixtures';
import { cohensWInterval } from './cohens-w-interval';
import { cohensW, effectSizeWord } from './cohens-w';
import { noncentralityInterval } from './noncentrality-interval';

describe("Cohen's w", () => {
  // Cohen, Statistical Power Analysis for the Behavioral Sciences, 2nd ed. (1988), section 7.2.3 (from memory): .1 small, .3 medium, .5 large.
  it('is √(X²/n) with the conventional words', () => {
    expect(cohensW(9, 100)).toBeCloseTo(0.3, 15);
    expect(effectSizeWord(0.05)).toBe('negligible');
    expect(effectSizeWord(0.1)).toBe('small');
    expect(effectSizeWord(0.3)).toBe('medium');
    expect(effectSizeWord(0.5)).toBe('large');
  });

  it('has an interval whose limits invert the noncentral distribution (Steiger & Fouladi 1997), as SciPy and mpmath find them', () => {
    // Limits solved with scipy.optimize.brentq on scipy.stats.ncx2 and polished in mpmath (tools/fixtures/engine-reference.py);
    // the engine's root finder stops at relative 1e-10 in λ.
    const { cases } = readFixture('cohens-w-interval');
    for (const row of cases.filter((item) => item.lambdaHigh > 0)) {
      const at = `X² ${row.statistic}, df ${row.df}, level ${row.level}`;
      const lambda = noncentralityInterval(row.statistic, row.df, row.level);
      expectClose(lambda.low, row.lambdaLow, { relative: 1e-9, absolute: 1e-12 }, `λ low, ${at}`);
      expectClose(lambda.high, row.lambdaHigh, { relative: 1e-9 }, `λ high, ${at}`);
      const w = cohensWInterval(row.statistic, row.df, row.n, row.level);
      expectClose(w.low, row.wLow, { relative: 1e-9, absolute: 1e-12 }, `w low, ${at}`);
      expectClose(w.high, row.wHigh, { relative: 1e-9 }, `w high, ${at}`);
      expect(w.level).toBe(row.level);
    }
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
