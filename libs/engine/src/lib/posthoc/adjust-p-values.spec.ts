import fc from 'fast-check';
import { adjustPValues } from './adjust-p-values';

describe('adjustPValues', () => {
  it("follows Holm's (1979) step-down rule", () => {
    // sorted: .005 × 4 = .02, .01 × 3 = .03, .03 × 2 = .06, .04 × 1 = .04 → running max .06
    expect(adjustPValues([0.01, 0.04, 0.03, 0.005], 'holm')).toEqual([0.03, 0.06, 0.06, 0.02]);
  });

  it('multiplies by m for Bonferroni, capped at 1, and leaves p alone for none', () => {
    expect(adjustPValues([0.01, 0.5], 'bonferroni')).toEqual([0.02, 1]);
    expect(adjustPValues([0.01, 0.5], 'none')).toEqual([0.01, 0.5]);
  });

  it('keeps Holm between the raw p and Bonferroni, in [0, 1] (property)', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 1, maxLength: 30 }), (pValues) => {
        const holm = adjustPValues(pValues, 'holm');
        const bonferroni = adjustPValues(pValues, 'bonferroni');
        holm.forEach((value, i) => {
          expect(value).toBeGreaterThanOrEqual(pValues[i]);
          expect(value).toBeLessThanOrEqual(bonferroni[i]);
          expect(value).toBeLessThanOrEqual(1);
        });
      }),
    );
  });
});
