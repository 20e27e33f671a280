/**
 * Benchmark cases for the exact multinomial test (timed by tools/bench/engine.bench.ts).
 *
 * Each case runs `method: 'auto'` with the default work budget, so the table shows both the
 * time and whether the case stayed exact. Observed counts other than the 9:3:3:1 segregation
 * counts are invented, chosen so that p lands near the stated value. The Monte Carlo cases run
 * a fixed number of draws; draws per second = draws / seconds.
 */
import { exactMultinomialTest, type ExactOrdering } from '../../../libs/engine/src/index';

export interface ExactBenchCase {
  name: string;
  run: () => { p: number; method: string; outcomesVisited?: number };
  /** Monte Carlo draws made by `run`, for a draws-per-second column */
  draws?: number;
}

const equalShares = (k: number): number[] => new Array<number>(k).fill(1 / k);
const ratioShares = (ratio: number[]): number[] => {
  const total = ratio.reduce((a, b) => a + b, 0);
  return ratio.map((r) => r / total);
};

interface Problem {
  label: string;
  counts: number[];
  shares: number[];
}

const problems: Problem[] = [
  // 9:3:3:1 dihybrid segregation counts 315, 108, 101, 32 (Mendel 1866), p ≈ 0.93.
  { label: 'n=556, 4 cells 9:3:3:1', counts: [315, 108, 101, 32], shares: ratioShares([9, 3, 3, 1]) },
  { label: 'n=100, 6 equal', counts: [20, 14, 18, 12, 22, 14], shares: equalShares(6) },
  { label: 'n=556, 6 cells 6:3:3:2:1:1, p≈0.015', counts: [234, 95, 91, 75, 41, 20], shares: ratioShares([6, 3, 3, 2, 1, 1]) },
  { label: 'n=200, 8 equal', counts: [30, 22, 25, 19, 28, 31, 20, 25], shares: equalShares(8) },
  { label: 'n=100, 10 equal', counts: [14, 8, 11, 6, 12, 9, 13, 7, 10, 10], shares: equalShares(10) },
  { label: 'n=1000, 6 equal, p≈0.01', counts: [191, 149, 179, 160, 135, 186], shares: equalShares(6) },
  { label: 'n=10000, 6 equal, p≈0.01', counts: [1740, 1600, 1710, 1620, 1590, 1740], shares: equalShares(6) },
  { label: 'n=1000, 10 equal, p≈0.01', counts: [125, 81, 105, 90, 114, 79, 106, 90, 116, 94], shares: equalShares(10) },
];

/** Extra cases beyond the required list: unequal shares (no symmetry to exploit) and a tiny p. */
const extraProblems: Problem[] = [
  {
    label: 'n=1000, 8 unequal (Benford-like), p≈0.01',
    counts: [343, 158, 106, 100, 90, 49, 72, 82],
    shares: ratioShares([30, 18, 12, 10, 8, 7, 7, 8]),
  },
  { label: 'n=5 000 000, 2 cells 1:1 (sample-ratio check)', counts: [2_502_600, 2_497_400], shares: [0.5, 0.5] },
  { label: 'n=300, 5 equal, far tail (p≈1e-12)', counts: [112, 27, 46, 58, 57], shares: equalShares(5) },
];

function exactCase(problem: Problem, ordering: ExactOrdering): ExactBenchCase {
  return {
    name: `exact ${ordering}: ${problem.label}`,
    run: () => {
      const result = exactMultinomialTest(problem.counts, problem.shares, { ordering, method: 'auto' });
      return { p: result.p, method: result.method, outcomesVisited: result.outcomesVisited };
    },
  };
}

function monteCarloCase(problem: Problem, draws: number): ExactBenchCase {
  return {
    name: `Monte Carlo ${draws.toLocaleString('en-US')} draws: ${problem.label}`,
    draws,
    run: () => {
      const result = exactMultinomialTest(problem.counts, problem.shares, {
        ordering: 'probability',
        method: 'monte-carlo',
        samples: draws,
      });
      return { p: result.p, method: result.method };
    },
  };
}

export const exactCases: ExactBenchCase[] = [
  ...problems.map((problem) => exactCase(problem, 'probability')),
  ...extraProblems.map((problem) => exactCase(problem, 'probability')),
  exactCase(problems[7], 'llr'),
  exactCase(problems[7], 'pearson'),
  monteCarloCase(problems[5], 200_000),
  monteCarloCase(problems[7], 200_000),
];

export default exactCases;
