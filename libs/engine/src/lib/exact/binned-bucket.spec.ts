import fc from 'fast-check';
import { BinnedBucket } from './binned-bucket';

describe('BinnedBucket', () => {
  it('gives the exact mass below any threshold, ties and repeated values included', () => {
    const entries = fc.array(fc.record({ stat: fc.integer({ min: 0, max: 40 }).map((v) => v / 4), weight: fc.double({ min: 0, max: 1, noNaN: true }) }), {
      minLength: 1,
      maxLength: 60,
    });
    const bucket = new BinnedBucket(4);
    fc.assert(
      fc.property(entries, fc.integer({ min: 0, max: 3 }), (list, padding) => {
        // Load from the middle of larger arrays to exercise the offsets.
        const stat = new Float64Array(list.length + 2 * padding).fill(99);
        const weight = new Float64Array(list.length + 2 * padding).fill(99);
        list.forEach((entry, i) => {
          stat[padding + i] = entry.stat;
          weight[padding + i] = entry.weight;
        });
        bucket.load(stat, weight, padding, padding + list.length);
        for (let x = -0.5; x <= 10.5; x += 0.125) {
          const expected = list.filter((entry) => entry.stat < x).reduce((sum, entry) => sum + entry.weight, 0);
          expect(bucket.massBelow(x)).toBeCloseTo(expected, 12);
        }
        expect(bucket.total).toBeCloseTo(list.reduce((sum, entry) => sum + entry.weight, 0), 12);
      }),
      { numRuns: 100, seed: 8 },
    );
  });
});
