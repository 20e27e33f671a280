/**
 * `npm run bench:sequential`: validity and power of the anytime-valid sequential test
 * (`analyzeSequential`) by simulation, printed as Markdown tables.
 *
 * - Under the null: the share of streams in which the test ever alarms within the looks (its
 *   false-alarm rate, which Ville's inequality bounds by α), with its Monte Carlo standard error
 *   √(r (1 − r) / streams), next to the fixed-sample Pearson test re-run on the cumulative counts
 *   at every look (which is expected far above α) and at the last look only (about α).
 * - Under an imbalance: the share of streams that alarm within the looks (power) and the median
 *   look of the first alarm (streams that never alarm count as later than the last look).
 * Every stream is seeded, so the tables are the same on every run.
 */
import { performance } from 'node:perf_hooks';
import { simulate, type StreamOutcome, type StreamScenario } from './sequential/simulate-streams';

const ALPHA = 0.05;

const nullScenarios: StreamScenario[] = [
  { name: 'two arms, 50/50', nullShares: [0.5, 0.5], trueShares: [0.5, 0.5], batchSize: 1000, looks: 100, streams: 2000, alpha: ALPHA, seed: 11 },
  {
    name: 'four categories, 40/30/20/10',
    nullShares: [0.4, 0.3, 0.2, 0.1],
    trueShares: [0.4, 0.3, 0.2, 0.1],
    batchSize: 1000,
    looks: 100,
    streams: 2000,
    alpha: ALPHA,
    seed: 12,
  },
];

const imbalanceScenarios: StreamScenario[] = [
  { name: '51/49 against 50/50 (a 2-point gap)', nullShares: [0.5, 0.5], trueShares: [0.51, 0.49], batchSize: 1000, looks: 100, streams: 1000, alpha: ALPHA, seed: 21 },
  {
    name: '51/49 against 50/50, concentration 1000',
    nullShares: [0.5, 0.5],
    trueShares: [0.51, 0.49],
    batchSize: 1000,
    looks: 100,
    streams: 1000,
    alpha: ALPHA,
    concentration: 1000,
    seed: 21,
  },
  { name: '50.5/49.5 against 50/50 (ratio 1.02)', nullShares: [0.5, 0.5], trueShares: [0.505, 0.495], batchSize: 1000, looks: 300, streams: 1000, alpha: ALPHA, seed: 22 },
];

function table(header: string[], rows: string[][]): string {
  const align = header.map((_, i) => (i === 0 ? '---' : '---:'));
  return [header, align, ...rows].map((cells) => `| ${cells.join(' | ')} |`).join('\n');
}

function rateWithError(hits: number, total: number): string {
  const rate = hits / total;
  const standardError = Math.sqrt((rate * (1 - rate)) / total);
  return `${rate.toFixed(4)} ± ${standardError.toFixed(4)}`;
}

/** Median of the first-alarm looks, streams without an alarm counting as after the last look. */
function medianLook(alarms: (number | null)[], looks: number): string {
  const sorted = alarms.map((look) => look ?? Infinity).sort((a, b) => a - b);
  const middle = sorted.length / 2;
  const median = sorted.length % 2 === 1 ? sorted[Math.floor(middle)] : (sorted[middle - 1] + sorted[middle]) / 2;
  return Number.isFinite(median) ? String(median) : `> ${looks}`;
}

function run(scenario: StreamScenario): { outcomes: StreamOutcome[]; seconds: number } {
  const start = performance.now();
  const outcomes = simulate(scenario);
  return { outcomes, seconds: (performance.now() - start) / 1000 };
}

function main(): void {
  console.log(`# Sequential test benchmark (node ${process.version}, ${new Date().toISOString().slice(0, 10)})\n`);
  console.log(`α = ${ALPHA}; prior concentration 100 unless stated; rates ± Monte Carlo standard error.\n`);

  const nullRows = nullScenarios.map((scenario) => {
    const { outcomes, seconds } = run(scenario);
    const count = (test: (outcome: StreamOutcome) => boolean) => outcomes.filter(test).length;
    return [
      scenario.name,
      `${scenario.streams} × ${scenario.looks} looks of ${scenario.batchSize.toLocaleString('en-US')}`,
      rateWithError(count((outcome) => outcome.sequentialAlarm !== null), scenario.streams),
      rateWithError(count((outcome) => outcome.pearsonAnyLook !== null), scenario.streams),
      rateWithError(count((outcome) => outcome.pearsonLastLook), scenario.streams),
      `${seconds.toFixed(1)} s`,
    ];
  });
  console.log('## False alarms under the null\n');
  console.log(
    table(
      ['stream', 'streams × looks', 'sequential test: ever alarmed', 'Pearson re-run at every look: ever p ≤ α', 'Pearson at the last look only', 'time'],
      nullRows,
    ),
  );

  const powerRows = imbalanceScenarios.map((scenario) => {
    const { outcomes, seconds } = run(scenario);
    const alarms = outcomes.map((outcome) => outcome.sequentialAlarm);
    const detected = alarms.filter((look) => look !== null).length;
    return [
      scenario.name,
      `${scenario.streams} × up to ${scenario.looks} looks of ${scenario.batchSize.toLocaleString('en-US')}`,
      String(scenario.concentration ?? 100),
      rateWithError(detected, scenario.streams),
      medianLook(alarms, scenario.looks),
      `${seconds.toFixed(1)} s`,
    ];
  });
  console.log('\n## Detection of an imbalance\n');
  console.log(table(['true split', 'streams × looks', 'concentration', 'alarmed within the looks', 'median looks to the alarm', 'time'], powerRows));
}

main();
