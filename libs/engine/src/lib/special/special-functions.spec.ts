import Decimal from 'decimal.js';
import { expectClose } from '../../testing/expect-close';
import { readFixture } from '../../testing/reference-fixtures';
import { jStat } from '../../testing/reference-libraries';
import { regularizedGammaTails } from './incomplete-gamma';
import { logGamma, stirlingError } from './log-gamma';
import { devianceTerm, logPoissonDensity } from './poisson-density';

// mpmath in 40 digits (tools/fixtures/engine-reference.py).
const reference = readFixture('special-functions');

describe('logGamma', () => {
  it('matches exact values: ln Γ(½) = ½ ln π, ln Γ(n) = ln (n − 1)!', () => {
    expectClose(logGamma(0.5), 0.5 * Math.log(Math.PI), { absolute: 2e-15 });
    expect(logGamma(1)).toBeCloseTo(0, 14);
    expect(logGamma(2)).toBeCloseTo(0, 14);
    expectClose(logGamma(11), Math.log(3628800), { relative: 1e-15 });
    expectClose(logGamma(171), 706.5730622457874, { relative: 1e-15 }); // ln 170!, A&S 6.1 tables extended (from memory)
  });

  it('matches mpmath.loggamma from 0.1 to 1e10 (a few ulps, or 4e-15 absolute near its zeros at 1 and 2)', () => {
    for (const row of reference.logGamma) {
      expectClose(logGamma(row.x), row.logGamma, { absolute: 4e-15, relative: 4 * Number.EPSILON }, `x ${row.x}`);
    }
  });

  it("agrees with jstat.gammaln over a grid (relative 1e-12, about jstat's own accuracy)", () => {
    for (const x of [0.1, 0.5, 0.9, 1.5, 2.5, 3.7, 9.99, 10, 10.01, 55.5, 1000.25, 1e6]) {
      expectClose(logGamma(x), jStat.gammaln(x), { absolute: 1e-12, relative: 1e-12 }, `x ${x}`);
    }
  });

  it('matches ln Γ(n + ½) = ln √π + Σ ln(k + ½) summed in 40-digit decimals (absolute 4e-15)', () => {
    const D = Decimal.clone({ precision: 40 });
    for (const n of [3, 12, 55, 300]) {
      let sum = D.acos(-1).sqrt().ln();
      for (let k = 0; k < n; k++) sum = sum.plus(new D(k).plus(0.5).ln());
      expectClose(logGamma(n + 0.5), sum.toNumber(), { absolute: 4e-15, relative: 1e-15 }, `n ${n}`);
    }
  });

  it("Stirling's error ln Γ(x + 1) − (x + ½) ln x + x − ½ ln 2π matches mpmath (relative 1e-14, or 4e-15 absolute below x = 10)", () => {
    for (const row of reference.stirlingError) {
      expectClose(stirlingError(row.x), row.stirlingError, { relative: 1e-14, absolute: 4e-15 }, `x ${row.x}`);
    }
  });
});

describe('Poisson density and deviance term', () => {
  it('agree with jstat.poisson.pdf (relative 1e-11)', () => {
    for (const lambda of [0.3, 2, 17, 250]) {
      for (const k of [0, 1, 3, 20, 260]) {
        const reference = jStat.poisson.pdf(k, lambda);
        if (reference < 1e-290 || !Number.isFinite(reference)) continue;
        expectClose(Math.exp(logPoissonDensity(k, lambda)), reference, { relative: 1e-11 }, `k ${k}, λ ${lambda}`);
      }
    }
  });

  it('match mpmath: ln of the density to a few ulps, D(x, m) to relative 1e-13', () => {
    for (const row of reference.poisson) {
      const at = `k ${row.k}, λ ${row.lambda}`;
      expectClose(logPoissonDensity(row.k, row.lambda), row.logDensity, { absolute: 1e-14, relative: 4 * Number.EPSILON }, `ln density, ${at}`);
      expectClose(devianceTerm(row.k, row.lambda), row.deviance, { relative: 1e-13 }, `deviance, ${at}`);
    }
  });

  it('computes D(x, m) = x ln(x/m) + m − x without cancellation near x = m', () => {
    // With t = (x − m)/m, D = m [(1 + t) ln(1 + t) − t] = m (t²/2 − t³/6 + t⁴/12 − …).
    const m = 1000.001;
    const t = (1000 - m) / m;
    expectClose(devianceTerm(1000, m), m * (t ** 2 / 2 - t ** 3 / 6 + t ** 4 / 12), { relative: 1e-12 });
    expect(devianceTerm(5, 5)).toBe(0);
    expect(devianceTerm(0, 3)).toBe(3);
  });
});

describe('regularised incomplete gamma', () => {
  it('matches mpmath.gammainc, each tail to relative 1e-12 and its log to 1e-12 absolute (fixture, a from 0.5 to 1e4)', () => {
    for (const row of reference.incompleteGamma) {
      const tails = regularizedGammaTails(row.a, row.x);
      const at = `a ${row.a}, x ${row.x}`;
      if (row.lower > 0) expectClose(tails.lower, row.lower, { relative: 1e-12 }, `P, ${at}`);
      if (row.upper > 0) expectClose(tails.upper, row.upper, { relative: 1e-12 }, `Q, ${at}`);
      expectClose(tails.logLower, row.logLower, { absolute: 1e-12, relative: 8 * Number.EPSILON }, `ln P, ${at}`);
      expectClose(tails.logUpper, row.logUpper, { absolute: 1e-12, relative: 8 * Number.EPSILON }, `ln Q, ${at}`);
    }
  });

  it('meets the identity Q(1, x) = e^−x', () => {
    for (const x of [0.01, 0.5, 1, 2, 10, 100, 700]) {
      expectClose(regularizedGammaTails(1, x).upper, Math.exp(-x), { relative: 1e-14 }, `x ${x}`);
      expect(regularizedGammaTails(1, x).logUpper).toBeCloseTo(-x, 12);
    }
  });

  it('agrees with jstat.lowRegGamma where both are accurate (relative 1e-9)', () => {
    for (const a of [0.5, 1.5, 3, 10, 40]) {
      for (const x of [0.1, 1, a, 2 * a]) {
        const reference = jStat.lowRegGamma(a, x);
        expectClose(regularizedGammaTails(a, x).lower, reference, { relative: 1e-9 }, `a ${a}, x ${x}`);
      }
    }
  });

  it('rejects a shape that is not positive', () => {
    expect(() => regularizedGammaTails(0, 1)).toThrow(RangeError);
    expect(() => regularizedGammaTails(1, -1)).toThrow(RangeError);
  });
});
