import fc from 'fast-check';
import { expectClose } from '../../testing/expect-close';
import { readFixture, rowWhere } from '../../testing/reference-fixtures';
import { jStat } from '../../testing/reference-libraries';
import { EngineInputError } from '../spec/engine-input-error';
import { exactMultinomialTest, ExactOrdering } from './index';

const ORDERINGS: ExactOrdering[] = ['probability', 'llr', 'pearson'];

function logFactorial(m: number): number {
  let sum = 0;
  for (let i = 2; i <= m; i++) sum += Math.log(i);
  return sum;
}

/**
 * Reference: visits every one of the C(n + k − 1, k − 1) outcomes, written independently of the
 * engine (textbook formulas, no shared code), with the same tie rule.
 */
function fullEnumeration(counts: number[], shares: number[], ordering: ExactOrdering): { p: number; logObserved: number } {
  const n = counts.reduce((a, b) => a + b, 0);
  const k = counts.length;
  if (n === 0) return { p: 1, logObserved: 0 };
  const statistic = (y: number[]): number => {
    let value = 0;
    for (let i = 0; i < k; i++) {
      const e = n * shares[i];
      if (shares[i] === 0) continue;
      if (ordering === 'pearson') value += (y[i] - e) ** 2 / e;
      else if (ordering === 'llr') value += y[i] > 0 ? 2 * y[i] * Math.log(y[i] / e) : 0;
      else value -= y[i] * Math.log(shares[i]) - logFactorial(y[i]);
    }
    return value;
  };
  const logProbability = (y: number[]): number => {
    let value = logFactorial(n);
    for (let i = 0; i < k; i++) {
      if (y[i] === 0) continue;
      if (shares[i] === 0) return -Infinity;
      value += y[i] * Math.log(shares[i]) - logFactorial(y[i]);
    }
    return value;
  };
  const observed = statistic(counts);
  const threshold = ordering === 'probability' ? observed - 1e-7 : observed - 1e-7 * Math.abs(observed);
  let p = 0;
  const y = new Array<number>(k).fill(0);
  const visit = (i: number, left: number): void => {
    if (i === k - 1) {
      y[i] = left;
      const logP = logProbability(y);
      if (logP > -Infinity && statistic(y) >= threshold) p += Math.exp(logP);
      return;
    }
    for (let v = 0; v <= left; v++) {
      y[i] = v;
      visit(i + 1, left - v);
    }
  };
  visit(0, n);
  return { p, logObserved: logProbability(counts) };
}

/** Small random problems: 2–5 categories, n up to 14, shares from small integer weights (ties and zeros included). */
const smallProblem = fc
  .integer({ min: 2, max: 5 })
  .chain((k) =>
    fc.record({
      weights: fc.array(fc.integer({ min: 0, max: 4 }), { minLength: k, maxLength: k }),
      counts: fc.array(fc.integer({ min: 0, max: 5 }), { minLength: k, maxLength: k }),
    }),
  )
  .filter(({ weights }) => weights.some((w) => w > 0))
  .map(({ weights, counts }) => {
    const total = weights.reduce((a, b) => a + b, 0);
    return { shares: weights.map((w) => w / total), counts: counts.map((c, i) => (weights[i] === 0 ? 0 : c)) };
  });

describe('exactMultinomialTest', () => {
  describe('agrees with full enumeration of every outcome', () => {
    for (const ordering of ORDERINGS) {
      it(`ordering ${ordering}: equal to the reference within 1e-10`, () => {
        fc.assert(
          fc.property(smallProblem, ({ shares, counts }) => {
            const reference = fullEnumeration(counts, shares, ordering);
            const result = exactMultinomialTest(counts, shares, { ordering, method: 'enumerate' });
            expect(result.method).toBe('enumerate');
            expectClose(result.p, reference.p, { relative: 1e-10, absolute: 1e-300 }, `counts ${counts}, shares ${shares}`);
            expect(result.massBound ?? 0).toBeLessThanOrEqual(1e-9 * reference.p);
          }),
          { numRuns: 150, seed: 31 },
        );
      });
    }

    it('matches in the far tail, where the search sums extreme outcomes directly (relative 1e-9)', () => {
      const farProblem = fc
        .record({
          weights: fc.array(fc.integer({ min: 1, max: 5 }), { minLength: 2, maxLength: 5 }),
          n: fc.integer({ min: 8, max: 18 }),
          spill: fc.integer({ min: 0, max: 2 }),
        })
        .map(({ weights, n, spill }) => {
          const total = weights.reduce((a, b) => a + b, 0);
          const shares = weights.map((w) => w / total);
          // Pile the counts on the least likely category, a few on the next one.
          const order = shares.map((_, i) => i).sort((a, b) => shares[a] - shares[b]);
          const counts = shares.map(() => 0);
          counts[order[0]] = n - spill;
          counts[order[1]] = spill;
          return { shares, counts };
        });
      for (const ordering of ORDERINGS) {
        fc.assert(
          fc.property(farProblem, ({ shares, counts }) => {
            const reference = fullEnumeration(counts, shares, ordering);
            const result = exactMultinomialTest(counts, shares, { ordering, method: 'enumerate' });
            expect(Math.abs(result.p - reference.p)).toBeLessThanOrEqual(1e-9 * reference.p);
            expect(Math.abs(result.logP - Math.log(reference.p))).toBeLessThanOrEqual(1e-9);
            expect(result.massBound ?? 0).toBeLessThanOrEqual(1e-9 * reference.p);
          }),
          { numRuns: 60, seed: 3 },
        );
      }
    });

    it('matches on larger problems with equal shares, where the search lists ordered count vectors only', () => {
      const cases: Array<[number[], number[]]> = [
        [[9, 2, 4, 5, 0, 3], new Array(6).fill(1 / 6)],
        [[5, 5, 1, 7, 2], [0.3, 0.3, 0.2, 0.1, 0.1]],
        [[12, 3, 3, 2], [9 / 16, 3 / 16, 3 / 16, 1 / 16]],
        [[0, 0, 0, 0, 22], [0.2, 0.2, 0.2, 0.2, 0.2]],
      ];
      for (const [counts, shares] of cases) {
        for (const ordering of ORDERINGS) {
          const reference = fullEnumeration(counts, shares, ordering);
          const result = exactMultinomialTest(counts, shares, { ordering, method: 'enumerate' });
          expect(Math.abs(result.p - reference.p)).toBeLessThanOrEqual(1e-10 * reference.p);
        }
      }
    });
  });

  it('matches brute-force enumeration in 40-digit mpmath for every ordering (relative 5e-12)', () => {
    // tools/fixtures/engine-reference.py lists every outcome in mpmath with the same documented tie rule; measured
    // agreement is 1e-12 or better.
    for (const row of readFixture('exact-multinomial').cases) {
      const total = row.weights.reduce((a, b) => a + b, 0);
      const shares = row.weights.map((weight) => weight / total);
      for (const ordering of ORDERINGS) {
        const result = exactMultinomialTest(row.counts, shares, { ordering, method: 'enumerate' });
        const at = `counts ${row.counts}, weights ${row.weights}, ${ordering}`;
        expectClose(result.p, row[ordering].p, { relative: 5e-12 }, `p, ${at}`);
        expectClose(result.logP, row[ordering].logP, { absolute: 5e-12 }, `ln p, ${at}`);
      }
    }
  });

  describe('properties', () => {
    it('p lies in [0, 1], is at least the probability of the observed outcome, and logP = ln p', () => {
      fc.assert(
        fc.property(smallProblem, fc.constantFrom(...ORDERINGS), ({ shares, counts }, ordering) => {
          const result = exactMultinomialTest(counts, shares, { ordering, method: 'auto' });
          const { logObserved } = fullEnumeration(counts, shares, ordering);
          expect(Number.isNaN(result.p)).toBe(false);
          expect(result.p).toBeGreaterThanOrEqual(0);
          expect(result.p).toBeLessThanOrEqual(1);
          expect(result.p).toBeGreaterThanOrEqual(Math.exp(logObserved) * (1 - 1e-9));
          expect(result.logP).toBeCloseTo(Math.log(result.p), 9);
        }),
        { numRuns: 200, seed: 7 },
      );
    });

    it('reordering the categories changes nothing', () => {
      fc.assert(
        fc.property(
          smallProblem.chain((problem) =>
            fc.tuple(fc.constant(problem), fc.shuffledSubarray(problem.counts.map((_, i) => i), { minLength: problem.counts.length })),
          ),
          fc.constantFrom(...ORDERINGS),
          ([{ shares, counts }, order], ordering) => {
            const original = exactMultinomialTest(counts, shares, { ordering, method: 'enumerate' });
            const permuted = exactMultinomialTest(
              order.map((i) => counts[i]),
              order.map((i) => shares[i]),
              { ordering, method: 'enumerate' },
            );
            expect(permuted.p).toBe(original.p);
          },
        ),
        { numRuns: 150, seed: 11 },
      );
    });
  });

  describe('published and hand-derived values', () => {
    it('reproduces a published exact binomial test', () => {
      // McDonald, Handbook of Biological Statistics, 3rd ed. (2014), "Exact test of goodness-of-fit"
      // (from memory): a cat used its right paw 8 times in 10 under a 1:1 hypothesis; the two-sided
      // exact P is 0.109. Exactly: (1 + 10 + 45) × 2 / 1024 = 112/1024.
      for (const ordering of ORDERINGS) {
        const result = exactMultinomialTest([2, 8], [0.5, 0.5], { ordering, method: 'enumerate' });
        expect(result.p).toBeCloseTo(0.109, 3);
        expect(result.p).toBeCloseTo(112 / 1024, 14);
      }
    });

    it('matches a small case worked by hand', () => {
      // Common practice, no source: 3 observations in 3 equally likely categories. Outcomes:
      // (3,0,0)-type, 3 of them at 1/27; (2,1,0)-type, 6 at 3/27; (1,1,1) at 6/27. Observing (2,1,0),
      // every outcome except (1,1,1) is no more probable: p = (3 + 18) / 27.
      const result = exactMultinomialTest([2, 1, 0], [1 / 3, 1 / 3, 1 / 3], { ordering: 'probability', method: 'enumerate' });
      expect(result.p).toBeCloseTo(21 / 27, 14);
    });

    it('gives exact tails in closed form, in log space where p underflows', () => {
      // Common practice, no source: all n observations in one of k equal categories is among the k
      // least probable outcomes, each of probability k^−n, so p = k^(1−n).
      const small = exactMultinomialTest([30, 0, 0, 0], [0.25, 0.25, 0.25, 0.25], { ordering: 'probability', method: 'enumerate' });
      expect(small.logP).toBeCloseTo(-29 * Math.log(4), 9);
      const tiny = exactMultinomialTest([0, 3000], [0.5, 0.5], { ordering: 'probability', method: 'auto' });
      expect(tiny.p).toBe(0);
      expect(tiny.logP).toBeCloseTo(-2999 * Math.log(2), 6);
      expect(tiny.method).toBe('enumerate');
    });
  });

  describe('two categories: the exact binomial test', () => {
    it('agrees with sums of jstat binomial probabilities over a grid (relative 1e-9)', () => {
      for (const n of [1, 7, 20, 55, 140]) {
        for (const share of [0.5, 0.3, 0.07, 0.9]) {
          for (const x of [0, 1, Math.floor(n / 3), Math.floor(n / 2), n - 1, n].filter((v, i, a) => v >= 0 && a.indexOf(v) === i)) {
            const observed = jStat.binomial.pdf(x, n, share);
            let reference = 0;
            for (let y = 0; y <= n; y++) {
              const probability = jStat.binomial.pdf(y, n, share);
              if (probability <= observed * (1 + 1e-7)) reference += probability;
            }
            const result = exactMultinomialTest([x, n - x], [share, 1 - share], { ordering: 'probability', method: 'enumerate' });
            expect(Math.abs(result.p - Math.min(1, reference))).toBeLessThanOrEqual(1e-9 * reference + 1e-15);
          }
        }
      }
    });

    it('handles a large sample-ratio check quickly and exactly', () => {
      // 5,000,000 visitors split 50/50: 2,502,600 vs 2,497,400 (z ≈ 2.33); p from scipy.stats.binomtest and mpmath.
      const result = exactMultinomialTest([2_502_600, 2_497_400], [0.5, 0.5], { ordering: 'probability', method: 'auto' });
      expect(result.method).toBe('enumerate');
      const reference = rowWhere(readFixture('binomial-test').cases, { x: 2_502_600, n: 5_000_000, share: 0.5 });
      expectClose(result.p, reference.p, { relative: 1e-12 });
    });
  });

  describe('Monte Carlo', () => {
    const counts = [14, 6, 9, 11, 3, 7];
    const shares = [0.25, 0.15, 0.2, 0.2, 0.1, 0.1];

    it('lands within four standard errors of the exact value for each ordering', () => {
      for (const ordering of ORDERINGS) {
        const exact = exactMultinomialTest(counts, shares, { ordering, method: 'enumerate' });
        const sampled = exactMultinomialTest(counts, shares, { ordering, method: 'monte-carlo', samples: 40_000, seed: 5 });
        expect(sampled.method).toBe('monte-carlo');
        expect(sampled.samples).toBe(40_000);
        expect(sampled.se).toBeGreaterThan(0);
        expect(Math.abs(sampled.p - exact.p)).toBeLessThan(4 * sampled.se!);
      }
    });

    it('is reproducible with a seed, and different seeds give different draws', () => {
      const options = { ordering: 'llr' as const, method: 'monte-carlo' as const, samples: 5000 };
      const a = exactMultinomialTest(counts, shares, { ...options, seed: 42 });
      const b = exactMultinomialTest(counts, shares, { ...options, seed: 42 });
      const c = exactMultinomialTest(counts, shares, { ...options, seed: 43 });
      expect(b).toEqual(a);
      expect(c.p).not.toBe(a.p);
      const unseeded = exactMultinomialTest(counts, shares, options);
      expect(exactMultinomialTest(counts, shares, options)).toEqual(unseeded);
    });

    it('never reports p = 0, so logP stays finite', () => {
      const result = exactMultinomialTest([40, 0, 0], [1 / 3, 1 / 3, 1 / 3], { ordering: 'pearson', method: 'monte-carlo', samples: 1000 });
      expect(result.p).toBeCloseTo(1 / 1001, 12);
      expect(Number.isFinite(result.logP)).toBe(true);
    });
  });

  describe('auto', () => {
    it('stays exact when the work fits the budget and samples when it does not', () => {
      const counts = [125, 81, 105, 90, 114, 79, 106, 90, 116, 94];
      const shares = new Array(10).fill(0.1);
      const sampled = exactMultinomialTest(counts, shares, { ordering: 'probability', method: 'auto', workBudget: 1000, samples: 2000 });
      expect(sampled.method).toBe('monte-carlo');
      const exact = exactMultinomialTest([9, 3, 5, 3], [0.25, 0.25, 0.25, 0.25], { ordering: 'probability', method: 'auto' });
      expect(exact.method).toBe('enumerate');
      expect(exact.outcomesVisited).toBeGreaterThan(0);
    });

    it('reports progress as non-decreasing fractions in [0, 1] ending at 1', () => {
      for (const method of ['enumerate', 'monte-carlo'] as const) {
        const seen: number[] = [];
        exactMultinomialTest([191, 149, 179, 160, 135, 186], new Array(6).fill(1 / 6), {
          ordering: 'pearson',
          method,
          samples: 20_000,
          onProgress: (fraction) => seen.push(fraction),
        });
        expect(seen.length).toBeGreaterThan(0);
        expect(seen[seen.length - 1]).toBe(1);
        seen.forEach((fraction, i) => {
          expect(fraction).toBeGreaterThanOrEqual(0);
          expect(fraction).toBeLessThanOrEqual(1);
          if (i > 0) expect(fraction).toBeGreaterThanOrEqual(seen[i - 1]);
        });
      }
    });
  });

  describe('edge cases', () => {
    it('drops zero-probability categories and accepts zero counts', () => {
      const withZero = exactMultinomialTest([4, 0, 2, 0], [0.5, 0, 0.25, 0.25], { ordering: 'probability', method: 'enumerate' });
      const without = exactMultinomialTest([4, 2, 0], [0.5, 0.25, 0.25], { ordering: 'probability', method: 'enumerate' });
      expect(withZero.p).toBe(without.p);
    });

    it('gives p = 1 when only one outcome is possible', () => {
      expect(exactMultinomialTest([0, 0, 0], [0.2, 0.3, 0.5], { ordering: 'llr', method: 'auto' }).p).toBe(1);
      expect(exactMultinomialTest([0, 9], [0, 1], { ordering: 'pearson', method: 'auto' }).p).toBe(1);
    });

    it('gives p = 1 when the observed counts equal the expected counts', () => {
      for (const ordering of ORDERINGS) {
        expect(exactMultinomialTest([25, 25, 50], [0.25, 0.25, 0.5], { ordering, method: 'auto' }).p).toBe(1);
      }
    });
  });

  describe('bad input', () => {
    const options = { ordering: 'probability' as const, method: 'auto' as const };
    const cases: Array<[string, () => unknown, string]> = [
      ['a negative count', () => exactMultinomialTest([3, -1], [0.5, 0.5], options), 'counts.1'],
      ['a fractional count', () => exactMultinomialTest([3, 1.5], [0.5, 0.5], options), 'counts.1'],
      ['one category', () => exactMultinomialTest([3], [1], options), 'counts'],
      ['mismatched lengths', () => exactMultinomialTest([3, 1], [0.5, 0.25, 0.25], options), 'probabilities'],
      ['a NaN probability', () => exactMultinomialTest([3, 1], [NaN, 0.5], options), 'probabilities.0'],
      ['probabilities not summing to 1', () => exactMultinomialTest([3, 1], [0.5, 0.4], options), 'probabilities'],
      ['a count in a zero-probability category', () => exactMultinomialTest([3, 1], [1, 0], options), 'counts.1'],
      ['an unknown ordering', () => exactMultinomialTest([3, 1], [0.5, 0.5], { ...options, ordering: 'chi' as never }), 'options.ordering'],
      ['an unknown method', () => exactMultinomialTest([3, 1], [0.5, 0.5], { ...options, method: 'fast' as never }), 'options.method'],
      ['zero samples', () => exactMultinomialTest([3, 1], [0.5, 0.5], { ...options, samples: 0 }), 'options.samples'],
      ['a fractional seed', () => exactMultinomialTest([3, 1], [0.5, 0.5], { ...options, seed: 0.5 }), 'options.seed'],
      ['a negative budget', () => exactMultinomialTest([3, 1], [0.5, 0.5], { ...options, workBudget: -1 }), 'options.workBudget'],
      [
        'exact enumeration of a problem far too large to list',
        () =>
          exactMultinomialTest(
            Array.from({ length: 40 }, (_, i) => (i % 2 === 0 ? 470 : 530)),
            new Array(40).fill(1 / 40),
            { ...options, method: 'enumerate' },
          ),
        'options.method',
      ],
    ];
    for (const [name, run, path] of cases) {
      it(`rejects ${name}, naming ${path}`, () => {
        expect(run).toThrow(EngineInputError);
        try {
          run();
        } catch (error) {
          expect((error as EngineInputError).issues[0].path).toBe(path);
        }
      });
    }
  });
});
