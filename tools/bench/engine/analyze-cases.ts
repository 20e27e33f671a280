/**
 * Benchmark cases for `analyze` (timed by tools/bench/engine.bench.ts): Pearson + G with the full
 * result (per-category exact binomial tests, intervals, effect-size interval, write-up) at k = 10
 * and k = 1000 categories. The counts are invented: a fixed pseudo-random wobble around equal
 * shares, so every run measures the same work.
 */
import { analyze, type AnalysisSpec } from '../../../libs/engine/src/index';

export interface AnalyzeBenchCase {
  name: string;
  spec: AnalysisSpec;
}

function wobbledCounts(k: number, perCategory: number): number[] {
  let state = 12345;
  return Array.from({ length: k }, () => {
    state = (state * 1103515245 + 12345) % 2147483648;
    return perCategory + Math.round(((state / 2147483648) * 2 - 1) * Math.sqrt(perCategory) * 1.5);
  });
}

function equalSharesCase(k: number, perCategory: number): AnalyzeBenchCase {
  const counts = wobbledCounts(k, perCategory);
  const n = counts.reduce((a, b) => a + b, 0);
  return {
    name: `analyze Pearson + G: k = ${k}, n = ${n.toLocaleString('en-US')}`,
    spec: { observed: { labels: counts.map((_, i) => `category ${i + 1}`), counts }, hypothesis: { kind: 'equal' }, tests: ['pearson', 'g'] },
  };
}

export const analyzeCases: AnalyzeBenchCase[] = [equalSharesCase(10, 100), equalSharesCase(1000, 100), equalSharesCase(10, 100_000)];

/** Run one case once (the bench times repeated calls). */
export function runAnalyzeCase(benchCase: AnalyzeBenchCase): number {
  return analyze(benchCase.spec).tests.pearson?.p ?? Number.NaN;
}

export default analyzeCases;
