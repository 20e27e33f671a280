import fc from 'fast-check';
import { expectClose } from '../../testing/expect-close';
import { readFixture } from '../../testing/reference-fixtures';
import { jStat } from '../../testing/reference-libraries';
import { EngineInputError } from '../spec/engine-input-error';
import { power, sampleSize } from './power';

// P(χ²(df, n w²) > c) from the mpmath mixture, confirmed with scipy.stats.ncx2; sample sizes solved in mpmath
// from scipy.optimize.brentq (tools/fixtures/engine-reference.py).
const reference = readFixture('power');

describe('power', () => {
  it('matches the df = 1 normal identity: power = Φ(√λ − z) + Φ(−√λ − z)', () => {
    // w = 0.3, n = 100: λ = 9, z = 1.959964; Cohen, Statistical Power Analysis for the Behavioral Sciences, 2nd ed.
    // (1988), Table 7.3.15 lists power .85 (from memory).
    const result = power({ w: 0.3, df: 1, n: 100 });
    const z = jStat.normal.inv(0.975, 0, 1);
    const reference = jStat.normal.cdf(3 - z, 0, 1) + jStat.normal.cdf(-3 - z, 0, 1);
    expectClose(result.power, reference, { absolute: 1e-12 });
    expect(result.power).toBeCloseTo(0.85, 2);
    expect(result.ncp).toBeCloseTo(9, 12);
    expect(result.criticalValue).toBeCloseTo(3.841459, 6);
  });

  it('matches SciPy and mpmath over w, df, n and alpha (relative 1e-13)', () => {
    for (const row of reference.power) {
      const result = power({ w: row.w, df: row.df, n: row.n, alpha: row.alpha });
      const at = `w ${row.w}, df ${row.df}, n ${row.n}, alpha ${row.alpha}`;
      expectClose(result.power, row.power, { relative: 1e-13 }, `power, ${at}`);
      expectClose(result.criticalValue, row.criticalValue, { relative: 1e-14 }, `critical value, ${at}`);
      expectClose(result.ncp, row.ncp, { relative: 2 * Number.EPSILON }, `λ, ${at}`);
    }
  });

  it('rises with n and with w (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.02, max: 1, noNaN: true }), fc.integer({ min: 1, max: 20 }), fc.integer({ min: 5, max: 5000 }), (w, df, n) => {
        const base = power({ w, df, n }).power;
        expect(base).toBeGreaterThan(0.05 - 1e-12);
        expect(base).toBeLessThanOrEqual(1);
        expect(power({ w, df, n: n + 10 }).power).toBeGreaterThanOrEqual(base - 1e-15);
        expect(power({ w: w * 1.1, df, n }).power).toBeGreaterThanOrEqual(base - 1e-15);
      }),
      { numRuns: 100 },
    );
  });

  it('rejects impossible inputs, naming the field', () => {
    expect(() => power({ w: 0, df: 1, n: 10 })).toThrow(EngineInputError);
    expect(() => power({ w: 0.3, df: 1.5, n: 10 })).toThrow(/df must be a whole number/);
    expect(() => power({ w: 0.3, df: 1, n: 10, alpha: 1 })).toThrow(/alpha/);
  });
});

describe('sampleSize', () => {
  it('reproduces Cohen (1988) Table 7.4.6: λ = 7.85 and n = 785 for w = .10, df = 1, power .80, α = .05', () => {
    // Cohen, Statistical Power Analysis for the Behavioral Sciences, 2nd ed. (1988), Table 7.4.6 (from memory):
    // n = 785 for w = .10 (u = 1, α = .05, power .80) and λ = 7.85.
    const result = sampleSize({ w: 0.1, df: 1, power: 0.8 });
    expect(result.n).toBe(785);
    expect(result.nContinuous * 0.01).toBeCloseTo(7.85, 2);
    // Independent solution of the df = 1 identity with jstat's normal distribution, by bisection.
    const z = jStat.normal.inv(0.975, 0, 1);
    const powerAt = (lambda: number) => jStat.normal.cdf(Math.sqrt(lambda) - z, 0, 1) + jStat.normal.cdf(-Math.sqrt(lambda) - z, 0, 1);
    let low = 0;
    let high = 50;
    for (let i = 0; i < 200; i++) {
      const middle = (low + high) / 2;
      if (powerAt(middle) < 0.8) low = middle;
      else high = middle;
    }
    expectClose(result.nContinuous, low / 0.01, { relative: 1e-9 });
    expect(result.power).toBeGreaterThanOrEqual(0.8);
  });

  it('matches SciPy and mpmath: the continuous n to relative 1e-12, the whole n exactly', () => {
    for (const row of reference.sampleSize) {
      const result = sampleSize({ w: row.w, df: row.df, power: row.power, alpha: row.alpha });
      const at = `w ${row.w}, df ${row.df}, power ${row.power}, alpha ${row.alpha}`;
      expectClose(result.nContinuous, row.nContinuous, { relative: 1e-12 }, `n continuous, ${at}`);
      expect(result.n).toBe(row.n);
      expectClose(result.power, row.powerAtN, { relative: 1e-13 }, `power at n, ${at}`);
    }
  });

  it('returns the smallest whole n that reaches the power (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.05, max: 0.9, noNaN: true }),
        fc.integer({ min: 1, max: 12 }),
        fc.double({ min: 0.5, max: 0.99, noNaN: true }),
        (w, df, target) => {
          const result = sampleSize({ w, df, power: target });
          expect(result.power).toBeGreaterThanOrEqual(target);
          expect(result.n).toBeGreaterThanOrEqual(result.nContinuous - 1e-6);
          if (result.n > 1) expect(power({ w, df, n: result.n - 1 }).power).toBeLessThan(target);
        },
      ),
      { numRuns: 60 },
    );
  });

  it('rejects a target power not above alpha', () => {
    expect(() => sampleSize({ w: 0.3, df: 2, power: 0.04 })).toThrow(/power must be above alpha/);
  });
});
