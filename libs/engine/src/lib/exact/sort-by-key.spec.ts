import fc from 'fast-check';
import { sortByKey } from './sort-by-key';

describe('sortByKey', () => {
  it('sorts a sub-range ascending and carries the companion values along', () => {
    fc.assert(
      fc.property(fc.array(fc.integer({ min: -50, max: 50 }), { maxLength: 300 }), fc.nat(5), fc.nat(5), (values, before, after) => {
        const keys = new Float64Array([...new Array(before).fill(1000), ...values, ...new Array(after).fill(-1000)]);
        // The companion encodes each key so pairing can be checked after the sort.
        const companion = keys.map((key) => key * 10 + 3);
        sortByKey(keys, companion, before, before + values.length);
        const sorted = values.slice().sort((a, b) => a - b);
        expect(Array.from(keys.subarray(before, before + values.length))).toEqual(sorted);
        for (let i = 0; i < keys.length; i++) expect(companion[i]).toBe(keys[i] * 10 + 3);
        expect(Array.from(keys.subarray(0, before)).every((key) => key === 1000)).toBe(true);
        expect(Array.from(keys.subarray(before + values.length)).every((key) => key === -1000)).toBe(true);
      }),
      { numRuns: 200, seed: 2 },
    );
  });
});
