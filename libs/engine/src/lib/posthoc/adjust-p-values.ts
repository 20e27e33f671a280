/**
 * Multiplicity adjustment of per-category p-values.
 * - Bonferroni: min(1, m p).
 * - Holm (1979, Scand. J. Statist. 6:65), step-down: with p sorted ascending,
 *   p_adj(i) = max_{j <= i} min(1, (m − j + 1) p(j)).
 */
export type AdjustMethod = 'holm' | 'bonferroni' | 'none';

export function adjustPValues(pValues: readonly number[], method: AdjustMethod): number[] {
  const m = pValues.length;
  if (method === 'none') return [...pValues];
  if (method === 'bonferroni') return pValues.map((p) => Math.min(1, m * p));
  const order = pValues.map((_, index) => index).sort((a, b) => pValues[a] - pValues[b]);
  const adjusted = new Array<number>(m);
  let runningMax = 0;
  order.forEach((index, rank) => {
    runningMax = Math.max(runningMax, Math.min(1, (m - rank) * pValues[index]));
    adjusted[index] = runningMax;
  });
  return adjusted;
}
