/**
 * Multiplicity adjustment of a family of p-values (per-category tests, segments).
 * - Bonferroni: min(1, m p).
 * - Holm (1979, Scand. J. Statist. 6:65), step-down, controls the family-wise error rate: with p
 *   sorted ascending, p_adj(i) = max_{j <= i} min(1, (m − j + 1) p(j)).
 * - Benjamini–Hochberg (1995, J. R. Statist. Soc. B 57(1):289–300), step-up, controls the false
 *   discovery rate: p_adj(i) = min_{j >= i} min(1, m p(j) / j).
 */
export type AdjustMethod = 'holm' | 'bonferroni' | 'benjamini-hochberg' | 'none';

export function adjustPValues(pValues: readonly number[], method: AdjustMethod): number[] {
  const m = pValues.length;
  if (method === 'none') return [...pValues];
  if (method === 'bonferroni') return pValues.map((p) => Math.min(1, m * p));
  if (method === 'benjamini-hochberg') return benjaminiHochberg(pValues);
  const order = pValues.map((_, index) => index).sort((a, b) => pValues[a] - pValues[b]);
  const adjusted = new Array<number>(m);
  let runningMax = 0;
  order.forEach((index, rank) => {
    runningMax = Math.max(runningMax, Math.min(1, (m - rank) * pValues[index]));
    adjusted[index] = runningMax;
  });
  return adjusted;
}

function benjaminiHochberg(pValues: readonly number[]): number[] {
  const m = pValues.length;
  const order = pValues.map((_, index) => index).sort((a, b) => pValues[a] - pValues[b]);
  const adjusted = new Array<number>(m);
  let runningMin = 1;
  for (let rank = m - 1; rank >= 0; rank--) {
    const index = order[rank];
    runningMin = Math.min(runningMin, (m * pValues[index]) / (rank + 1));
    adjusted[index] = runningMin;
  }
  return adjusted;
}
