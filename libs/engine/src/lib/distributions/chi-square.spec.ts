import fc from 'fast-check';
import { closedFormLogUpperTail } from '../../testing/chi-square-closed-form';
import { expectClose } from '../../testing/expect-close';
import { readFixture, rowWhere } from '../../testing/reference-fixtures';
import { jStat, stdlibChiSquareCdf, stdlibChiSquareQuantile } from '../../testing/reference-libraries';
import {
  chiSquareCdf,
  chiSquareCriticalValue,
  chiSquareLogSurvival,
  chiSquareQuantile,
  chiSquareSurvival,
  chiSquareTails,
} from './chi-square';

const DEGREES = [1, 2, 3, 4, 5, 7, 10, 15, 20, 30, 50, 100, 200, 500, 1000];
// mpmath.gammainc (regularized) in 40 digits, written by tools/fixtures/engine-reference.py.
const reference = readFixture('chi-square');
const MULTIPLES = [0.01, 0.1, 0.3, 0.5, 0.8, 1, 1.2, 1.5, 2, 3];

describe('chi-square tails', () => {
  it('reproduces the p-value of a published example', () => {
    // McDonald, Handbook of Biological Statistics, 3rd ed. (2014), "Chi-square test of goodness-of-fit"
    // (from memory): X² = 5.607 on 1 d.f. gives P = 0.0179.
    expect(chiSquareSurvival(5.6071, 1)).toBeCloseTo(0.0179, 4);
    expectClose(chiSquareSurvival(5.6071, 1), rowWhere(reference.tails, { x: 5.6071, df: 1 }).upper, { relative: 1e-12 });
  });

  it('matches the standard critical values table', () => {
    // Abramowitz & Stegun, Handbook of Mathematical Functions (1964), Table 26.8 "Percentage points of the
    // χ²-distribution", pp. 984–985 (page numbers from memory): upper 5% points 3.841, 5.991, 7.815, 18.307; 1%: 6.635.
    expect(chiSquareCriticalValue(0.05, 1)).toBeCloseTo(3.841, 3);
    expect(chiSquareCriticalValue(0.05, 2)).toBeCloseTo(5.991, 3);
    expect(chiSquareCriticalValue(0.05, 3)).toBeCloseTo(7.815, 3);
    expect(chiSquareCriticalValue(0.05, 10)).toBeCloseTo(18.307, 3);
    expect(chiSquareCriticalValue(0.01, 1)).toBeCloseTo(6.635, 3);
  });

  it('agrees with @stdlib on the lower tail over a grid (relative 1e-12)', () => {
    for (const df of DEGREES) {
      for (const multiple of MULTIPLES) {
        const x = df * multiple;
        const reference = stdlibChiSquareCdf(x, df);
        if (reference === 0) continue;
        expectClose(chiSquareCdf(x, df), reference, { relative: 1e-12 }, `df ${df}, x ${x}`);
      }
    }
  });

  it('agrees with @stdlib on the upper tail where 1 − cdf is still accurate (relative 1e-9)', () => {
    for (const df of DEGREES) {
      for (const multiple of MULTIPLES) {
        const x = df * multiple;
        const reference = 1 - stdlibChiSquareCdf(x, df);
        // 1 − cdf loses about −log10(reference) digits; compare only where at least 9 remain.
        if (reference < 1e-6) continue;
        expectClose(chiSquareSurvival(x, df), reference, { relative: 1e-9 }, `df ${df}, x ${x}`);
      }
    }
  });

  it('agrees with jstat on the lower tail over a grid (relative 1e-9)', () => {
    for (const df of DEGREES) {
      for (const multiple of MULTIPLES) {
        const x = df * multiple;
        const reference = jStat.chisquare.cdf(x, df);
        if (reference < 1e-300) continue;
        expectClose(chiSquareCdf(x, df), reference, { relative: 1e-9 }, `df ${df}, x ${x}`);
      }
    }
  });

  it('matches the closed forms (ln p to 2e-14 + 8 ulps of |ln p|), far into the tail where the libraries return 0', () => {
    // Reference: Abramowitz & Stegun 26.4.4–26.4.5 in 80-digit arithmetic (testing/chi-square-closed-form.ts).
    for (const df of [1, 2, 3, 4, 5, 9, 10, 31, 100]) {
      for (const x of [0.001, 0.5, 2, 8, 30, 100, 300, 1500, 1e4, 1e5]) {
        const reference = closedFormLogUpperTail(x, df);
        const logP = chiSquareLogSurvival(x, df);
        expectClose(logP, reference, { absolute: 2e-14 + 8 * Number.EPSILON * Math.abs(reference) }, `df ${df}, x ${x}`);
        if (reference > -700) expectClose(chiSquareSurvival(x, df), Math.exp(reference), { relative: 1e-12 }, `p at df ${df}, x ${x}`);
      }
    }
  });

  it('gives the far-tail log p-values stated in the specification, where 1 − cdf is 0', () => {
    // df = 1, x = 1500: ln p ≈ −753.883; df = 3, x = 1e4: ln p ≈ −4995.6 (mpmath fixture; also the closed forms above).
    expectClose(chiSquareLogSurvival(1500, 1), rowWhere(reference.tails, { x: 1500, df: 1 }).logUpper, { relative: 4 * Number.EPSILON });
    expectClose(chiSquareLogSurvival(1e4, 3), rowWhere(reference.tails, { x: 1e4, df: 3 }).logUpper, { relative: 4 * Number.EPSILON });
    expect(1 - stdlibChiSquareCdf(1500, 1)).toBe(0);
    expect(1 - jStat.chisquare.cdf(1e4, 3)).toBe(0);
    // df = 2 has Q = e^{−x/2} exactly.
    expect(chiSquareLogSurvival(1e4, 2)).toBe(-5000);
  });

  it('handles the edges: x = 0, huge df, x below 0', () => {
    expect(chiSquareTails(0, 1)).toEqual({ upper: 1, logUpper: 0, lower: 0, logLower: -Infinity });
    expect(chiSquareSurvival(-3, 4)).toBe(1);
    expect(chiSquareSurvival(1e6, 1e6)).toBeGreaterThan(0.4);
    expect(chiSquareSurvival(1e6, 1e6)).toBeLessThan(0.6);
    expect(() => chiSquareSurvival(1, 0)).toThrow(RangeError);
    expect(() => chiSquareSurvival(Number.NaN, 1)).toThrow(RangeError);
  });

  it('quantiles agree with @stdlib (relative 1e-10) and round-trip', () => {
    for (const df of DEGREES) {
      for (const p of [1e-6, 0.01, 0.05, 0.5, 0.95, 0.99]) {
        expectClose(chiSquareQuantile(p, df), stdlibChiSquareQuantile(p, df), { relative: 1e-10 }, `df ${df}, p ${p}`);
      }
    }
    fc.assert(
      fc.property(fc.double({ min: 1e-200, max: 0.999, noNaN: true }), fc.integer({ min: 1, max: 300 }), (alpha, df) => {
        const x = chiSquareCriticalValue(alpha, df);
        expectClose(chiSquareSurvival(x, df), alpha, { relative: 1e-10 }, `alpha ${alpha}, df ${df}`);
      }),
      { numRuns: 200 },
    );
  });

  it('gives each tail and its logarithm as mpmath does, the small tail to relative 1e-12 (fixture, 1e-4 to 1e4 × df)', () => {
    for (const row of reference.tails) {
      const tails = chiSquareTails(row.x, row.df);
      const at = `x ${row.x}, df ${row.df}`;
      if (row.upper > 0) expectClose(tails.upper, row.upper, { relative: 1e-12 }, `upper, ${at}`);
      else expect(tails.upper).toBe(0);
      if (row.lower > 0) expectClose(tails.lower, row.lower, { relative: 1e-12 }, `lower, ${at}`);
      // ln p's absolute error is p's relative error (1e-12 as above); far out, a few ulps of |ln p|.
      expectClose(tails.logUpper, row.logUpper, { absolute: 1e-12, relative: 8 * Number.EPSILON }, `ln upper, ${at}`);
      expectClose(tails.logLower, row.logLower, { absolute: 1e-12, relative: 8 * Number.EPSILON }, `ln lower, ${at}`);
    }
  });

  it('gives critical values and lower quantiles as mpmath does (relative 1e-13, fixture)', () => {
    for (const row of reference.quantiles) {
      expectClose(chiSquareCriticalValue(row.alpha, row.df), row.criticalValue, { relative: 1e-13 }, `critical value, alpha ${row.alpha}, df ${row.df}`);
      if (row.lowerQuantile !== undefined) {
        expectClose(chiSquareQuantile(row.alpha, row.df), row.lowerQuantile, { relative: 1e-13 }, `lower quantile, p ${row.alpha}, df ${row.df}`);
      }
    }
  });

  it('keeps p in [0, 1] and the log consistent (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1e5, noNaN: true }), fc.double({ min: 0.5, max: 2000, noNaN: true }), (x, df) => {
        const tails = chiSquareTails(x, df);
        expect(tails.upper).toBeGreaterThanOrEqual(0);
        expect(tails.upper).toBeLessThanOrEqual(1);
        expect(Number.isNaN(tails.logUpper)).toBe(false);
        if (tails.upper > 1e-300) expectClose(Math.log(tails.upper), tails.logUpper, { absolute: 1e-12 });
      }),
      { numRuns: 500 },
    );
  });
});
