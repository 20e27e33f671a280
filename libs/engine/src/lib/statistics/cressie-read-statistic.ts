/**
 * The Cressie–Read power-divergence statistic (Cressie & Read 1984, JRSS B 46:440)
 *   2 / (λ(λ + 1)) Σ O [(O / E)^λ − 1],
 * with the limits λ → 0 (G) and λ → −1 (2 Σ E ln(E / O)). Each term is formed with expm1 so
 * that λ near 0 loses no digits. Needs λ > −1 when some O = 0 (the schema enforces λ > −1).
 */
import { gStatistic } from './g-statistic';

export const DEFAULT_CRESSIE_READ_LAMBDA = 2 / 3;

export function cressieReadStatistic(observed: readonly number[], expected: readonly number[], lambda: number): number {
  if (lambda === 0) return gStatistic(observed, expected);
  let sum = 0;
  for (let i = 0; i < observed.length; i++) {
    const o = observed[i];
    const e = expected[i];
    if (e <= 0) continue;
    // An empty cell adds nothing: O (O/E)^λ → 0 as O → 0 when λ > −1.
    if (o > 0) sum += o * Math.expm1(lambda * Math.log(o / e));
  }
  // Σ O [(O/E)^λ − 1] equals Σ [O (O/E)^λ − O]; when ΣO = ΣE this is the power divergence.
  return Math.max(0, (2 / (lambda * (lambda + 1))) * sum);
}
