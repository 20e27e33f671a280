import fc from 'fast-check';
import { coreCountFilter, countWindow, tailCountFilter } from './category-tables';
import { logProbabilityOffset } from './category-terms';

describe('countWindow', () => {
  it('finds exactly the counts the filter keeps, for core and tail filters', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 200 }),
        fc.double({ min: 0.01, max: 0.99, noNaN: true }),
        fc.double({ min: 0.1, max: 40, noNaN: true }),
        fc.constantFrom('pearson', 'llr', 'probability' as const),
        (n, share, limit, ordering) => {
          const filters = [
            coreCountFilter(ordering, n, share, limit, logProbabilityOffset(n)),
            tailCountFilter(n, share, -limit),
          ];
          for (const keep of filters) {
            const window = countWindow(n, share, keep);
            for (let y = 0; y <= n; y++) expect(keep(y)).toBe(y >= window.lo && y <= window.hi);
          }
        },
      ),
      { numRuns: 200, seed: 4 },
    );
  });
});
