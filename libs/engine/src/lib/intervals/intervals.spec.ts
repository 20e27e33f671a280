import { expectClose } from '../../testing/expect-close';
import { logFactorial } from '../special/log-gamma';
import { goodmanIntervals, quesenberryHurstIntervals, scoreInterval, wilsonIntervals } from './score-intervals';
import { shareIntervals } from './share-intervals';
import { sisonGlazCoverage, sisonGlazIntervals } from './sison-glaz';
import { chiSquareCriticalValue } from '../distributions/chi-square';

/** Exact multinomial probability of the box |Xᵢ − nᵢ| <= c under p̂ = nᵢ/n, by enumerating every outcome. */
function exactBoxProbability(counts: readonly number[], c: number): number {
  const n = counts.reduce((a, b) => a + b, 0);
  const logShares = counts.map((x) => Math.log(x / n));
  const k = counts.length;
  const y = new Array<number>(k).fill(0);
  let total = 0;
  const visit = (index: number, remaining: number) => {
    if (index === k - 1) {
      y[index] = remaining;
      if (Math.abs(remaining - counts[index]) > c) return;
      let logP = logFactorial(n);
      for (let i = 0; i < k; i++) logP += (y[i] > 0 ? y[i] * logShares[i] : 0) - logFactorial(y[i]);
      total += Math.exp(logP);
      return;
    }
    for (let value = Math.max(0, counts[index] - c); value <= Math.min(remaining, counts[index] + c); value++) {
      y[index] = value;
      visit(index + 1, remaining - value);
    }
  };
  visit(0, n);
  return total;
}

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
  it('approximate the exact box probability ν(c) closely (absolute 0.01)', () => {
    const counts = [23, 31, 18, 28];
    for (const c of [3, 6, 9, 12]) {
      expectClose(sisonGlazCoverage(counts, c), exactBoxProbability(counts, c), { absolute: 0.01 }, `c ${c}`);
    }
  });

  it('choose c with exact ν(c) < level <= ν(c + 1) (Sison & Glaz 1995, section 2)', () => {
    const counts = [23, 31, 18, 28];
    const n = 100;
    const intervals = sisonGlazIntervals(counts, 0.95);
    const c = Math.round((counts[0] / n - intervals[0].low) * n);
    expect(exactBoxProbability(counts, c)).toBeLessThan(0.95);
    expect(exactBoxProbability(counts, c + 1)).toBeGreaterThanOrEqual(0.95);
    // every interval has the same width (2c + 2γ)/n before cutting to [0, 1]
    const widths = intervals.map((interval) => interval.high - interval.low);
    widths.forEach((width) => expectClose(width, widths[0], { absolute: 1e-12 }));
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
