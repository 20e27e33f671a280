import { jStat } from '../../testing/reference-libraries';
import { chiSquareSurvival } from '../distributions/chi-square';
import { sampleBinomial } from './binomial-sampler';
import { RandomSource } from './random-source';

/** Pearson goodness-of-fit of sampled frequencies against jstat's binomial probabilities, cells with expected < 5 pooled. */
function fitPValue(n: number, p: number, draws: number, seed: number): number {
  const random = new RandomSource(seed);
  const frequencies = new Float64Array(n + 1);
  for (let i = 0; i < draws; i++) frequencies[sampleBinomial(random, n, p)]++;
  let statistic = 0;
  let cells = 0;
  let pooledObserved = 0;
  let pooledExpected = 0;
  for (let x = 0; x <= n; x++) {
    pooledObserved += frequencies[x];
    pooledExpected += draws * jStat.binomial.pdf(x, n, p);
    if (pooledExpected >= 5) {
      statistic += (pooledObserved - pooledExpected) ** 2 / pooledExpected;
      cells++;
      pooledObserved = 0;
      pooledExpected = 0;
    }
  }
  statistic += pooledExpected > 0 ? (pooledObserved - pooledExpected) ** 2 / pooledExpected : pooledObserved > 0 ? Infinity : 0;
  return chiSquareSurvival(statistic, Math.max(1, cells - 1));
}

describe('sampleBinomial', () => {
  // Each case draws with a fixed seed, so the check is deterministic; a sampler with the wrong
  // distribution would give p-values far below 1e-4 at these sample sizes.
  const cases: Array<[number, number]> = [
    [10, 0.3], // inversion
    [40, 0.1], // inversion, mean 4
    [60, 0.5], // transformed rejection
    [1000, 0.1], // transformed rejection
    [500, 0.93], // transformed rejection through the complement
    [1000, 0.45], // transformed rejection, the largest n where jstat's binomial density is still finite
  ];
  for (const [n, p] of cases) {
    it(`matches the Binomial(${n}, ${p}) probabilities (goodness-of-fit p > 1e-4)`, () => {
      expect(fitPValue(n, p, 200_000, n + 17)).toBeGreaterThan(1e-4);
    });
  }

  // Beyond n ≈ 1000 jstat's density returns NaN, so large n is checked through the closed-form
  // moments (common practice, no source): mean np, variance npq, third central moment npq(q − p).
  for (const [n, p] of [
    [250, 0.2],
    [130_000, 0.5], // counts on both sides of the sampler's log-factorial table
    [2_000_000, 0.037],
  ] as Array<[number, number]>) {
    it(`has the moments of Binomial(${n}, ${p})`, () => {
      const random = new RandomSource(n);
      const draws = 200_000;
      const q = 1 - p;
      const variance = n * p * q;
      let sum = 0;
      let sumSquares = 0;
      let sumCubes = 0;
      for (let i = 0; i < draws; i++) {
        const d = sampleBinomial(random, n, p) - n * p;
        sum += d;
        sumSquares += d * d;
        sumCubes += d * d * d;
      }
      const meanShift = sum / draws;
      expect(Math.abs(meanShift)).toBeLessThan(5 * Math.sqrt(variance / draws));
      expect(sumSquares / draws / variance).toBeGreaterThan(0.98);
      expect(sumSquares / draws / variance).toBeLessThan(1.02);
      // Standardised skewness (q − p)/√(npq), standard error of the sample value ≈ √(6 / draws).
      const skewness = sumCubes / draws / variance ** 1.5;
      expect(Math.abs(skewness - (q - p) / Math.sqrt(variance))).toBeLessThan(5 * Math.sqrt(6 / draws));
    });
  }

  it('handles the degenerate cases', () => {
    const random = new RandomSource(1);
    expect(sampleBinomial(random, 0, 0.4)).toBe(0);
    expect(sampleBinomial(random, 12, 0)).toBe(0);
    expect(sampleBinomial(random, 12, 1)).toBe(12);
  });
});
