/**
 * Simulated streams for the sequential benchmark: batches of multinomial counts drawn with the
 * engine's seeded random source, each stream run through `analyzeSequential` and, for comparison,
 * through the fixed-sample Pearson test re-run on the cumulative counts at every look.
 */
import { analyzeSequential, chiSquareSurvival } from '../../../libs/engine/src/index';
import { sampleBinomial } from '../../../libs/engine/src/lib/exact/binomial-sampler';
import { RandomSource } from '../../../libs/engine/src/lib/exact/random-source';
import { pearsonStatistic } from '../../../libs/engine/src/lib/statistics/pearson-statistic';

export interface StreamScenario {
  name: string;
  /** the hypothesis tested (null shares) */
  nullShares: number[];
  /** the shares the counts are really drawn from */
  trueShares: number[];
  batchSize: number;
  looks: number;
  streams: number;
  alpha: number;
  concentration?: number;
  seed: number;
}

export interface StreamOutcome {
  /** first look (1-based) at which the sequential test alarmed, or null */
  sequentialAlarm: number | null;
  /** first look at which the fixed-sample Pearson test had p ≤ α, or null */
  pearsonAnyLook: number | null;
  /** the fixed-sample Pearson test at the last look only */
  pearsonLastLook: boolean;
}

/** One multinomial draw by successive conditional binomials. */
function multinomial(random: RandomSource, size: number, shares: readonly number[]): number[] {
  const counts: number[] = [];
  let left = size;
  let shareLeft = 1;
  for (let i = 0; i < shares.length - 1; i++) {
    const x = left === 0 ? 0 : sampleBinomial(random, left, Math.min(1, shares[i] / shareLeft));
    counts.push(x);
    left -= x;
    shareLeft -= shares[i];
  }
  counts.push(left);
  return counts;
}

export function simulate(scenario: StreamScenario): StreamOutcome[] {
  const random = new RandomSource(scenario.seed);
  const labels = scenario.nullShares.map((_, i) => `category ${i + 1}`);
  const df = scenario.nullShares.length - 1;
  const outcomes: StreamOutcome[] = [];
  for (let s = 0; s < scenario.streams; s++) {
    const batches = Array.from({ length: scenario.looks }, () => multinomial(random, scenario.batchSize, scenario.trueShares));
    const result = analyzeSequential({
      observed: { labels },
      hypothesis: { kind: 'proportions', values: scenario.nullShares },
      batches,
      alpha: scenario.alpha,
      concentration: scenario.concentration,
    });
    let pearsonAnyLook: number | null = null;
    let pearsonLastLook = false;
    result.looks.forEach((look) => {
      const expected = scenario.nullShares.map((share) => share * look.n);
      const rejected = chiSquareSurvival(pearsonStatistic(look.counts, expected), df) <= scenario.alpha;
      if (rejected && pearsonAnyLook === null) pearsonAnyLook = look.batch;
      if (look.batch === scenario.looks) pearsonLastLook = rejected;
    });
    outcomes.push({ sequentialAlarm: result.firstAlarm, pearsonAnyLook, pearsonLastLook });
  }
  return outcomes;
}
