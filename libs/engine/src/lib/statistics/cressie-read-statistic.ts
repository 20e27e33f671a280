/**
 * The Cressie–Read power-divergence statistic (Cressie & Read 1984, JRSS B 46:440)
 *   2 / (λ(λ + 1)) Σ O [(O / E)^λ − 1],
 * with the limits λ → 0 (G) and λ → −1 (2 Σ E ln(E / O)). Each term is formed with expm1 so
 * that λ near 0 loses no digits. Needs λ > −1 when some O = 0 (the schema enforces λ > −1).
 */
import { gStatistic } from './g-statistic';

export const DEFAULT_CRESSIE_READ_LAMBDA = 2 / 3;

/** (e^{λt} − 1)/λ, by its Taylor series when λt is tiny so that no λ near 0 divides anything. */
function expm1OverLambda(lambda: number, t: number): number {
  const x = lambda * t;
  if (Math.abs(x) < 1e-5) return t * (1 + x / 2 + (x * x) / 6);
  return Math.expm1(x) / lambda;
}

export function cressieReadStatistic(observed: readonly number[], expected: readonly number[], lambda: number): number {
  if (lambda === 0) return gStatistic(observed, expected);
  // 2 / (λ(λ + 1)) Σ O [(O/E)^λ − 1] = 2 / (λ + 1) Σ O (e^{λ ln(O/E)} − 1) / λ
  let sum = 0;
  for (let i = 0; i < observed.length; i++) {
    const o = observed[i];
    const e = expected[i];
    // An empty cell adds nothing: O (O/E)^λ → 0 as O → 0 when λ > −1.
    if (e > 0 && o > 0) sum += o * expm1OverLambda(lambda, Math.log(o / e));
  }
  // Σ O [(O/E)^λ − 1] equals Σ [O (O/E)^λ − O]; when ΣO = ΣE this is the power divergence.
  return Math.max(0, (2 / (lambda + 1)) * sum);
}
