import Decimal from 'decimal.js';
import fc from 'fast-check';
import { expectClose } from '../../testing/expect-close';
import { readFixture, rowWhere } from '../../testing/reference-fixtures';
import { jStat } from '../../testing/reference-libraries';
import { binomialLogProbability } from './binomial-log-probability';
import { binomialTest } from './binomial-test';

/** Two-sided p by summing every outcome's jstat probability (small n only). */
function bruteForce(x: number, n: number, p: number): number {
  const observed = jStat.binomial.pdf(x, n, p);
  let total = 0;
  for (let j = 0; j <= n; j++) {
    const probability = jStat.binomial.pdf(j, n, p);
    if (probability <= observed * (1 + 1e-7)) total += probability;
  }
  return Math.min(1, total);
}

/**
 * Two-sided p in exact rational arithmetic for p = a / 1000: P(j) ∝ C(n, j) a^j (1000 − a)^{n−j},
 * ties within a relative 1e-7 decided exactly, the sum divided by 1000^n in 40-digit decimals.
 */
function exactRational(x: number, n: number, a: number): number {
  const N = BigInt(n);
  const A = BigInt(a);
  const B = 1000n - A;
  const weights: bigint[] = [];
  let choose = 1n;
  for (let j = 0n; j <= N; j++) {
    weights.push(choose * A ** j * B ** (N - j));
    choose = (choose * (N - j)) / (j + 1n);
  }
  const observed = weights[x];
  let total = 0n;
  for (const weight of weights) if (weight * 10_000_000n <= observed * 10_000_001n) total += weight;
  const D = Decimal.clone({ precision: 40, minE: -9e15 });
  return new D(total.toString()).dividedBy(new D((1000n ** N).toString())).toNumber();
}

describe('binomial probabilities', () => {
  it("agree with jstat (relative 1e-9, about jstat's own accuracy)", () => {
    for (const n of [1, 5, 20, 100, 500]) {
      for (const p of [0.01, 0.25, 0.5, 0.9]) {
        for (const x of [0, 1, Math.floor(n / 3), n]) {
          const reference = jStat.binomial.pdf(x, n, p);
          if (reference < 1e-290) continue;
          expectClose(Math.exp(binomialLogProbability(x, n, p)), reference, { relative: 1e-9 }, `x ${x}, n ${n}, p ${p}`);
        }
      }
    }
  });

  it('match exact rational arithmetic (relative 1e-13)', () => {
    // C(500, 166) (1/4)^166 (3/4)^334 = C(500, 166) 3^334 / 4^500, in integers.
    const D = Decimal.clone({ precision: 40 });
    let choose = 1n;
    for (let i = 0n; i < 166n; i++) choose = (choose * (500n - i)) / (i + 1n);
    const exact = new D((choose * 3n ** 334n).toString()).dividedBy(new D((4n ** 500n).toString()));
    expectClose(Math.exp(binomialLogProbability(166, 500, 0.25)), exact.toNumber(), { relative: 1e-13 });
  });
});

// Tail sums in 40-digit mpmath, confirmed with scipy.stats.binomtest (tools/fixtures/engine-reference.py).
const reference = readFixture('binomial-test');

describe('two-sided exact binomial test', () => {
  it('reproduces a published example: 8 of 10 against 1/2 gives P = 0.109', () => {
    // McDonald, Handbook of Biological Statistics, 3rd ed. (2014), exact test of goodness-of-fit
    // (from memory): P = 0.109; exactly 2 × 56/1024 = 0.109375.
    expect(binomialTest(8, 10, 0.5).p).toBeCloseTo(0.109375, 14);
  });

  it('matches scipy.stats.binomtest and mpmath, n from 1 to 5 million, p to relative 1e-13 and ln p to a few ulps', () => {
    for (const row of reference.cases) {
      const result = binomialTest(row.x, row.n, row.share);
      const at = `x ${row.x}, n ${row.n}, share ${row.share}`;
      if (row.p > 0) expectClose(result.p, row.p, { relative: 1e-13 }, `p, ${at}`);
      else expect(result.p).toBe(0);
      expectClose(result.logP, row.logP, { absolute: 1e-13, relative: 4 * Number.EPSILON }, `ln p, ${at}`);
    }
  });

  it('agrees with exact rational arithmetic, into the far tail (property, relative 1e-12)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 250 }), fc.integer({ min: 1, max: 999 }), fc.nat(), (n, a, seed) => {
        const x = seed % (n + 1);
        const result = binomialTest(x, n, a / 1000);
        expectClose(result.p, exactRational(x, n, a), { relative: 1e-12 }, `x ${x}, n ${n}, p ${a / 1000}`);
      }),
      { numRuns: 200 },
    );
  });

  it('agrees with summing every outcome with jstat where jstat is accurate (property, relative 1e-8)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 300 }), fc.double({ min: 0.001, max: 0.999, noNaN: true }), fc.nat(), (n, p, seed) => {
        const x = seed % (n + 1);
        const reference = bruteForce(x, n, p);
        const result = binomialTest(x, n, p);
        expect(result.p).toBeGreaterThanOrEqual(jStat.binomial.pdf(x, n, p) * (1 - 1e-8));
        if (reference > 1e-200) expectClose(result.p, reference, { relative: 1e-8 }, `x ${x}, n ${n}, p ${p}`);
      }),
      { numRuns: 300 },
    );
  });

  it('keeps ln p finite in the far tail', () => {
    // x = 0 of n = 1e6 at p = 1/2: p = 2 × 2^−n exactly.
    const result = binomialTest(0, 1e6, 0.5);
    expect(result.p).toBe(0);
    expectClose(result.logP, Math.LN2 - 1e6 * Math.LN2, { relative: 1e-12 });
  });

  it('gives p = 1 at the mode and handles degenerate shares', () => {
    expect(binomialTest(5, 10, 0.5).p).toBe(1);
    expect(binomialTest(0, 10, 0).p).toBe(1);
    expect(binomialTest(10, 10, 1).p).toBe(1);
    expect(binomialTest(3, 10, 0).p).toBe(0);
    expect(() => binomialTest(11, 10, 0.5)).toThrow(RangeError);
  });

  it('is exact for large n (a million trials)', () => {
    const result = binomialTest(500_800, 1_000_000, 0.5);
    expectClose(result.p, rowWhere(reference.cases, { x: 500_800, n: 1_000_000, share: 0.5 }).p, { relative: 1e-13 });
  });
});
