import fc from 'fast-check';
import { expectClose } from '../../testing/expect-close';
import { readFixture, rowWhere } from '../../testing/reference-fixtures';
import { cressieReadStatistic } from './cressie-read-statistic';
import { gStatistic, williamsCorrection } from './g-statistic';
import { pearsonStatistic } from './pearson-statistic';

const countsAndExpected = fc
  .array(fc.integer({ min: 0, max: 500 }), { minLength: 2, maxLength: 12 })
  .filter((counts) => counts.some((c) => c > 0))
  .chain((counts) =>
    fc.array(fc.double({ min: 0.01, max: 1, noNaN: true }), { minLength: counts.length, maxLength: counts.length }).map((weights) => {
      const n = counts.reduce((a, b) => a + b, 0);
      const total = weights.reduce((a, b) => a + b, 0);
      return { counts, expected: weights.map((w) => (w / total) * n) };
    }),
  );

// 40-digit mpmath values (tools/fixtures/engine-reference.py), G confirmed with scipy.stats.power_divergence.
const reference = readFixture('statistics');

describe('test statistics', () => {
  it('Pearson X² is 0 at a perfect fit and adds squared standardised differences', () => {
    expect(pearsonStatistic([10, 20], [10, 20])).toBe(0);
    // McDonald, Handbook of Biological Statistics, 3rd ed. (2014), "Chi-square test of goodness-of-fit" (from memory): X² = 5.607.
    expect(pearsonStatistic([1752, 1895], [1823.5, 1823.5])).toBeCloseTo(5.607, 3);
    expectClose(pearsonStatistic([1752, 1895], [1823.5, 1823.5]), rowWhere(reference.cases, { counts: [1752, 1895] }).pearson, { relative: 4 * Number.EPSILON });
  });

  it('match Pearson, G and Cressie–Read computed in 40 digits, from λ = −0.9 to 3 (a few ulps to 1e-13)', () => {
    for (const row of reference.cases) {
      expectClose(pearsonStatistic(row.counts, row.expected), row.pearson, { relative: 1e-14, absolute: 1e-14 }, `Pearson, ${row.name}`);
      expectClose(gStatistic(row.counts, row.expected), row.g, { relative: 1e-13, absolute: 1e-13 }, `G, ${row.name}`);
      for (const { lambda, statistic } of row.cressieRead) {
        expectClose(cressieReadStatistic(row.counts, row.expected, lambda), statistic, { relative: 1e-12, absolute: 1e-13 }, `Cressie–Read λ ${lambda}, ${row.name}`);
      }
    }
  });

  it('G treats 0 ln 0 as 0', () => {
    expect(gStatistic([0, 10], [5, 5])).toBeCloseTo(2 * 10 * Math.log(2), 14);
  });

  it("Williams' q reduces to 1 + (k + 1)/(6n) when no parameter is estimated (Sokal & Rohlf, Biometry, 3rd ed. (1995), section 17.2, from memory)", () => {
    expect(williamsCorrection(4, 556, 3)).toBeCloseTo(1 + 5 / (6 * 556), 15);
    expect(williamsCorrection(2, 100, 1)).toBeCloseTo(1 + 3 / 600, 15);
  });

  it('Cressie–Read is Pearson at λ = 1, G at λ = 0 and Freeman–Tukey 4Σ(√O − √E)² at λ = −½ (Cressie & Read 1984)', () => {
    fc.assert(
      fc.property(countsAndExpected, ({ counts, expected }) => {
        const pearson = pearsonStatistic(counts, expected);
        const g = gStatistic(counts, expected);
        const freemanTukey = 4 * counts.reduce((sum, o, i) => sum + (Math.sqrt(o) - Math.sqrt(expected[i])) ** 2, 0);
        expectClose(cressieReadStatistic(counts, expected, 1), pearson, { relative: 1e-9, absolute: 1e-9 });
        expectClose(cressieReadStatistic(counts, expected, 0), g, { relative: 1e-12, absolute: 1e-12 });
        expectClose(cressieReadStatistic(counts, expected, Number.MIN_VALUE), g, { relative: 1e-12, absolute: 1e-12 });
        expectClose(cressieReadStatistic(counts, expected, -0.5), freemanTukey, { relative: 1e-9, absolute: 1e-9 });
      }),
      { numRuns: 200 },
    );
  });

  it('are never negative or NaN (property)', () => {
    fc.assert(
      fc.property(countsAndExpected, fc.double({ min: -0.99, max: 5, noNaN: true }), ({ counts, expected }, lambda) => {
        for (const value of [pearsonStatistic(counts, expected), gStatistic(counts, expected), cressieReadStatistic(counts, expected, lambda)]) {
          expect(Number.isNaN(value)).toBe(false);
          expect(value).toBeGreaterThanOrEqual(0);
        }
      }),
    );
  });
});
