import fc from 'fast-check';
import { buildCategoryTable } from './category-tables';
import { buildSuffixMinimum } from './suffix-minimum';

describe('buildSuffixMinimum', () => {
  it('equals the brute-force minimum over every split of each total, for each suffix', () => {
    const windows = fc.array(
      fc.record({ lo: fc.integer({ min: 0, max: 4 }), width: fc.integer({ min: 0, max: 5 }), expected: fc.double({ min: 0.5, max: 6, noNaN: true }) }),
      { minLength: 1, maxLength: 4 },
    );
    fc.assert(
      fc.property(windows, fc.constantFrom('pearson', 'llr', 'probability' as const), (specs, ordering) => {
        const tables = specs.map((w) => buildCategoryTable(ordering, w.expected, w.lo, w.lo + w.width, true));
        const suffix = buildSuffixMinimum(tables);
        for (let j = 0; j < tables.length; j++) {
          // Brute force: every count vector of categories j.. within their windows.
          const best = new Map<number, number>();
          const visit = (i: number, total: number, score: number): void => {
            if (i === tables.length) {
              best.set(total, Math.min(best.get(total) ?? Infinity, score));
              return;
            }
            for (let y = tables[i].lo; y <= tables[i].hi; y++) visit(i + 1, total + y, score + tables[i].score[y - tables[i].lo]);
          };
          visit(j, 0, 0);
          expect(suffix.minima[j].length).toBe(best.size);
          for (const [total, score] of best) {
            const index = total - suffix.base[j];
            expect(suffix.minima[j][index]).toBeCloseTo(score, 10);
            // The recorded share of category j is part of an optimal split.
            const share = tables[j].lo + suffix.firstShare[j][index];
            const rest = j + 1 < tables.length ? suffix.minima[j + 1][total - share - suffix.base[j + 1]] : 0;
            expect(tables[j].score[share - tables[j].lo] + rest).toBeCloseTo(score, 10);
          }
        }
      }),
      { numRuns: 100, seed: 5 },
    );
  });
});
