/**
 * Whether one category departs from its expected share on its own: its per-category p-value,
 * adjusted for the number of categories, is below alpha. The write-up's "driven by" list and the
 * console's ▲/▼ markers both use this rule, so they always name the same categories.
 */
import type { CategoryRow } from '../result/analysis-result';

export type Departure = 'above' | 'below';

export function standsOut(row: Pick<CategoryRow, 'observed' | 'expected' | 'pAdjusted'>, alpha: number): Departure | undefined {
  if (!(row.pAdjusted < alpha)) return undefined;
  return row.observed > row.expected ? 'above' : 'below';
}
