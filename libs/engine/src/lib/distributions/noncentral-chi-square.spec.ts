import fc from 'fast-check';
import { expectClose } from '../../testing/expect-close';
import { readFixture, rowWhere } from '../../testing/reference-fixtures';
import { jStat } from '../../testing/reference-libraries';
import { noncentralChiSquareTail, noncentralChiSquareTails } from './noncentral-chi-square';

// The Poisson mixture in 40-digit mpmath, confirmed with scipy.stats.ncx2 (tools/fixtures/engine-reference.py).
const reference = readFixture('noncentral-chi-square');

/** P(χ²(1, λ) > x) = Φ(√λ − √x) + Φ(−√λ − √x): the square of a normal with mean √λ (rule of the trade). */
function oneDegreeReference(x: number, lambda: number): { upper: number; lower: number } {
  const root = Math.sqrt(x);
  const shift = Math.sqrt(lambda);
  return {
    upper: jStat.normal.cdf(shift - root, 0, 1) + jStat.normal.cdf(-shift - root, 0, 1),
    lower: jStat.normal.cdf(root - shift, 0, 1) - jStat.normal.cdf(-root - shift, 0, 1),
  };
}

/** The Poisson mixture of central tails, summed naively with jstat (only for small λ). */
function mixtureReference(x: number, df: number, lambda: number): number {
  let total = 0;
  for (let j = 0; j < 150; j++) total += jStat.poisson.pdf(j, lambda / 2) * (1 - jStat.chisquare.cdf(x, df + 2 * j));
  return total;
}

describe('noncentral chi-square', () => {
  it('matches the normal-square identity for df = 1 (absolute 1e-14)', () => {
    for (const lambda of [0.1, 1, 5, 10, 50, 100, 1000, 1e4]) {
      for (const x of [0.5, 1, 3.84, 10, 50, 200, 1500, 12000]) {
        const tails = noncentralChiSquareTails(x, 1, lambda);
        const reference = oneDegreeReference(x, lambda);
        expectClose(tails.upper, reference.upper, { absolute: 1e-14 }, `upper, x ${x}, λ ${lambda}`);
        expectClose(tails.lower, reference.lower, { absolute: 1e-14 }, `lower, x ${x}, λ ${lambda}`);
      }
    }
  });

  it('matches the Poisson mixture of jstat central tails (absolute 1e-10)', () => {
    for (const df of [2, 3, 5, 10, 30]) {
      for (const lambda of [0.5, 3, 20, 80]) {
        for (const x of [1, 5, 10, 30, 100]) {
          expectClose(noncentralChiSquareTails(x, df, lambda).upper, mixtureReference(x, df, lambda), { absolute: 1e-10 }, `df ${df}, λ ${lambda}, x ${x}`);
        }
      }
    }
  });

  it('gives both tails as mpmath does, each to absolute 3e-14 (fixture: df 1 to 30, λ 0.1 to 10⁴)', () => {
    // Measured: the largest error is 2.3e-14 (λ = 1000); small tails are meant to be accurate in absolute terms only.
    for (const row of reference.cases) {
      const tails = noncentralChiSquareTails(row.x, row.df, row.lambda);
      const at = `x ${row.x}, df ${row.df}, λ ${row.lambda}`;
      expectClose(tails.upper, row.upper, { absolute: 3e-14 }, `upper, ${at}`);
      expectClose(tails.lower, row.lower, { absolute: 3e-14 }, `lower, ${at}`);
      // One tail alone is meant for tails that are not close to 1.
      if (row.upper <= 0.5) expectClose(noncentralChiSquareTail(row.x, row.df, row.lambda, 'upper'), row.upper, { absolute: 3e-14 }, `upper alone, ${at}`);
      if (row.lower <= 0.5) expectClose(noncentralChiSquareTail(row.x, row.df, row.lambda, 'lower'), row.lower, { absolute: 3e-14 }, `lower alone, ${at}`);
    }
  });

  it('reduces to the central distribution at λ = 0 and handles the ends', () => {
    expectClose(noncentralChiSquareTails(7.81, 3, 0).upper, rowWhere(reference.cases, { x: 7.81, df: 3, lambda: 0 }).upper, { relative: 1e-12 });
    expect(noncentralChiSquareTails(0, 3, 5)).toEqual({ upper: 1, lower: 0 });
    expect(() => noncentralChiSquareTails(1, 3, -1)).toThrow(RangeError);
  });

  it('has tails in [0, 1] whose upper tail rises with λ (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.01, max: 500, noNaN: true }),
        fc.integer({ min: 1, max: 100 }),
        fc.double({ min: 0, max: 400, noNaN: true }),
        (x, df, lambda) => {
          const tails = noncentralChiSquareTails(x, df, lambda);
          expect(tails.upper).toBeGreaterThanOrEqual(0);
          expect(tails.upper).toBeLessThanOrEqual(1);
          expect(noncentralChiSquareTails(x, df, lambda + 1).upper).toBeGreaterThanOrEqual(tails.upper - 1e-15);
        },
      ),
      { numRuns: 300 },
    );
  });
});
