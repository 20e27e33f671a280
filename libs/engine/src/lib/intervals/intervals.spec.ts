import { expectClose } from '../../testing/expect-close';
import { readFixture } from '../../testing/reference-fixtures';
import { goodmanIntervals, quesenberryHurstIntervals, scoreInterval, wilsonIntervals } from './score-intervals';
import { shareIntervals } from './share-intervals';
import { sisonGlazCoverage, sisonGlazIntervals } from './sison-glaz';
import { chiSquareCriticalValue } from '../distributions/chi-square';

// Computed in mpmath by tools/fixtures/engine-reference.py: ν(c) from Sison & Glaz's Edgeworth formula (moments summed
// directly) and from enumerating every outcome in the box; the intervals; Wilson's closed form.
const reference = readFixture('intervals');

describe('Wilson score intervals', () => {
  it('reproduce Newcombe (1998, Statistics in Medicine 17:857, Table I, method 3; from memory)', () => {
    const z2 = chiSquareCriticalValue(0.05, 1);
    const cases: [number, number, number, number][] = [
      [81, 263, 0.2553, 0.3662],
      [15, 148, 0.0624, 0.1605],
      [0, 20, 0, 0.1611],
      [1, 29, 0.0061, 0.1718],
    ];
    for (const [x, n, low, high] of cases) {
      const interval = scoreInterval(x, n, z2);
      expect(interval.low).toBeCloseTo(low, 4);
      expect(interval.high).toBeCloseTo(high, 4);
    }
  });

  it('match the closed form evaluated in mpmath (relative 1e-14)', () => {
    const z2 = chiSquareCriticalValue(0.05, 1);
    for (const row of reference.wilson) {
      const interval = scoreInterval(row.x, row.n, z2);
      expectClose(interval.low, row.low, { relative: 1e-14, absolute: 1e-16 }, `low, ${row.x} of ${row.n}`);
      expectClose(interval.high, row.high, { relative: 1e-14 }, `high, ${row.x} of ${row.n}`);
    }
  });

  it('have the closed form bound z²/(n + z²) at x = 0 and stay inside [0, 1]', () => {
    const [zero, all] = wilsonIntervals([0, 20], 0.95);
    const z2 = chiSquareCriticalValue(0.05, 1);
    expectClose(zero.high, z2 / (20 + z2), { relative: 1e-15 });
    expect(zero.low).toBe(0);
    expect(all.high).toBe(1);
  });
});

describe('simultaneous score intervals', () => {
  it('Goodman uses the Bonferroni level α/k and Quesenberry–Hurst the χ²(k − 1) point, both wider than Wilson', () => {
    const counts = [91, 49, 37, 43];
    const wilson = wilsonIntervals(counts, 0.95);
    const goodman = goodmanIntervals(counts, 0.95);
    const qh = quesenberryHurstIntervals(counts, 0.95);
    const bonferroniWilson = wilsonIntervals(counts, 1 - 0.05 / 4);
    goodman.forEach((interval, i) => {
      expectClose(interval.low, bonferroniWilson[i].low, { relative: 1e-14 });
      expect(interval.low).toBeLessThan(wilson[i].low);
      expect(qh[i].low).toBeLessThan(goodman[i].low); // for k = 4, χ²₃(.95) = 7.81 > χ²₁(1 − .05/4) = 6.24
      expect(qh[i].high).toBeGreaterThan(goodman[i].high);
    });
  });

  it('dispatch by method name', () => {
    expect(shareIntervals([5, 10], 'goodman', 0.9)).toEqual(goodmanIntervals([5, 10], 0.9));
    expect(shareIntervals([5, 10], 'quesenberry-hurst', 0.9)).toEqual(quesenberryHurstIntervals([5, 10], 0.9));
  });
});

describe('Sison–Glaz intervals', () => {
  it("compute ν(c) by Sison & Glaz's Edgeworth formula as an independent implementation does (relative 1e-12 from c = 4)", () => {
    // Below c = 4 the engine forms each truncated variance as m₂ − m₁² from factorial moments, which cancels when the
    // truncation is narrow: measured 4e-11 at c = 1 for n = 100 and 1e-8 at c = 1 for n = 467. Those ν(c) are far
    // below any level, so the chosen c is not affected.
    for (const row of reference.coverage) {
      const tolerance = row.c >= 4 ? 1e-12 : 2e-8;
      expectClose(sisonGlazCoverage(row.counts, row.c), row.edgeworth, { relative: tolerance, absolute: 1e-300 }, `counts ${row.counts}, c ${row.c}`);
    }
  });

  it("approximate the exact box probability ν(c) to the method's own error (6.3e-4 here)", () => {
    // The Edgeworth approximation's largest error over c = 1 … 15 for these counts, measured against enumeration in mpmath.
    const tolerance = reference.edgeworthError * (1 + 1e-9);
    expect(reference.edgeworthError).toBeLessThan(7e-4);
    for (const row of reference.coverage.filter((item) => item.exact !== undefined && item.c > 0)) {
      expectClose(sisonGlazCoverage(row.counts, row.c), row.exact!, { absolute: tolerance }, `c ${row.c}`);
    }
    // c = 0 is the multinomial probability of the observed table itself: exact.
    const zero = reference.coverage.find((item) => item.c === 0 && item.exact !== undefined)!;
    expectClose(sisonGlazCoverage(zero.counts, 0), zero.exact!, { relative: 1e-12 });
  });

  it('choose c with ν(c) < level <= ν(c + 1) and widen by 2γ/n (Sison & Glaz 1995, section 2), as the reference does', () => {
    for (const row of reference.sisonGlaz) {
      const intervals = sisonGlazIntervals(row.counts, row.level);
      intervals.forEach((interval, i) => {
        const at = `counts ${row.counts}, level ${row.level}, category ${i}`;
        // γ = (level − ν(c)) / (ν(c + 1) − ν(c)) magnifies ν's relative 1e-13 about tenfold.
        expectClose(interval.low, row.intervals[i].low, { relative: 1e-11, absolute: 1e-15 }, `low, ${at}`);
        expectClose(interval.high, row.intervals[i].high, { relative: 1e-11 }, `high, ${at}`);
      });
    }
    // the exact box probabilities bracket the level at the chosen c for [23, 31, 18, 28] (c = 10: 0.94498 < 0.95 <= 0.97026)
    const chosen = reference.sisonGlaz.find((row) => row.level === 0.95 && row.counts.join() === '23,31,18,28')!;
    const exactAt = (c: number) => reference.coverage.find((item) => item.c === c && item.exact !== undefined)!.exact!;
    expect(exactAt(chosen.c)).toBeLessThan(0.95);
    expect(exactAt(chosen.c + 1)).toBeGreaterThanOrEqual(0.95);
  });

  it('are narrower than Goodman intervals with many categories, and stay in [0, 1]', () => {
    const counts = [56, 72, 73, 59, 62, 87, 58, 0];
    const sg = sisonGlazIntervals(counts, 0.95);
    const goodman = goodmanIntervals(counts, 0.95);
    const width = (i: { low: number; high: number }) => i.high - i.low;
    expect(width(sg[1])).toBeLessThan(width(goodman[1]));
    sg.forEach((interval) => {
      expect(interval.low).toBeGreaterThanOrEqual(0);
      expect(interval.high).toBeLessThanOrEqual(1);
    });
    expect(sg[7].low).toBe(0);
  });
});
