/** Properties of the sequential test on random streams (fast-check). */
import fc from 'fast-check';
import { analyzeSequential } from './analyze-sequential';

const streamArbitrary = fc.integer({ min: 2, max: 5 }).chain((k) =>
  fc.record({
    ratio: fc.array(fc.integer({ min: 1, max: 9 }), { minLength: k, maxLength: k }),
    batches: fc.array(fc.array(fc.integer({ min: 0, max: 400 }), { minLength: k, maxLength: k }), { minLength: 1, maxLength: 12 }),
    concentration: fc.constantFrom(0.5, 2, 100, 5000),
  }),
);

describe('sequential test properties', () => {
  it('p stays in [0, 1], never increases, and the bands hold the cumulative share', () => {
    fc.assert(
      fc.property(streamArbitrary, ({ ratio, batches, concentration }) => {
        const labels = ratio.map((_, i) => `c${i}`);
        const result = analyzeSequential({ observed: { labels }, hypothesis: { kind: 'ratio', values: ratio }, batches, concentration });
        let previous = 1;
        for (const look of result.looks) {
          expect(look.p).toBeGreaterThanOrEqual(0);
          expect(look.p).toBeLessThanOrEqual(previous);
          expect(Number.isFinite(look.logBayesFactor)).toBe(true);
          previous = look.p;
          for (const share of look.shares) {
            expect(share.lower).toBeGreaterThanOrEqual(0);
            expect(share.upper).toBeLessThanOrEqual(1);
            expect(share.lower).toBeLessThanOrEqual(share.estimate);
            expect(share.upper).toBeGreaterThanOrEqual(share.estimate);
          }
        }
      }),
      { numRuns: 150 },
    );
  });

  it('does not depend on the order of the categories', () => {
    fc.assert(
      fc.property(streamArbitrary, ({ ratio, batches, concentration }) => {
        const labels = ratio.map((_, i) => `c${i}`);
        const forward = analyzeSequential({ observed: { labels }, hypothesis: { kind: 'ratio', values: ratio }, batches, concentration });
        const reversed = analyzeSequential({
          observed: { labels: [...labels].reverse() },
          hypothesis: { kind: 'ratio', values: [...ratio].reverse() },
          batches: batches.map((batch) => [...batch].reverse()),
          concentration,
        });
        forward.looks.forEach((look, i) => {
          const other = reversed.looks[i];
          expect(other.logBayesFactor).toBeCloseTo(look.logBayesFactor, 9);
          const share = look.shares[0];
          const same = other.shares[other.shares.length - 1];
          expect(same.lower).toBeCloseTo(share.lower, 9);
          expect(same.upper).toBeCloseTo(share.upper, 9);
        });
      }),
      { numRuns: 100 },
    );
  });
});
