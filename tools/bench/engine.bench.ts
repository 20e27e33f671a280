/**
 * `npm run bench:engine`: times the engine and prints Markdown tables.
 * - Exact test cases (tools/bench/engine/exact-cases.ts): time per run, method, p, outcomes visited,
 *   and Monte Carlo draws per second.
 * - `analyze` cases (tools/bench/engine/analyze-cases.ts): calls per second.
 * - Bounded-work cases (tools/bench/engine/bounded-work-cases.ts): huge n and tiny shares beside
 *   the method they replaced or an ordinary analysis.
 * Each case is run once to warm up, then repeated until at least MIN_SECONDS have passed (or
 * once more, for cases slower than that); the table shows the mean time per run.
 */
import { performance } from 'node:perf_hooks';
import { analyzeCases, runAnalyzeCase } from './engine/analyze-cases';
import { boundedWorkCases } from './engine/bounded-work-cases';
import { exactCases } from './engine/exact-cases';

const MIN_SECONDS = 1;

interface Timing<T> {
  secondsPerRun: number;
  runs: number;
  last: T;
}

function time<T>(work: () => T): Timing<T> {
  let last = work(); // warm-up
  const firstStart = performance.now();
  last = work();
  let elapsed = (performance.now() - firstStart) / 1000;
  let runs = 1;
  while (elapsed < MIN_SECONDS) {
    const start = performance.now();
    last = work();
    elapsed += (performance.now() - start) / 1000;
    runs++;
  }
  return { secondsPerRun: elapsed / runs, runs, last };
}

function table(header: string[], rows: string[][]): string {
  const align = header.map((_, i) => (i === 0 ? '---' : '---:'));
  return [header, align, ...rows].map((cells) => `| ${cells.join(' | ')} |`).join('\n');
}

function formatSeconds(seconds: number): string {
  if (seconds < 1e-3) return `${(seconds * 1e6).toFixed(0)} µs`;
  if (seconds < 1) return `${(seconds * 1e3).toFixed(1)} ms`;
  return `${seconds.toFixed(2)} s`;
}

function group(value: number): string {
  return Math.round(value).toLocaleString('en-US');
}

function main(): void {
  console.log(`# Engine benchmark (node ${process.version}, ${new Date().toISOString().slice(0, 10)})\n`);
  if (exactCases.length > 0) {
    const rows = exactCases.map((benchCase) => {
      const timing = time(benchCase.run);
      const { p, method, outcomesVisited } = timing.last;
      return [
        benchCase.name,
        method,
        p.toPrecision(4),
        outcomesVisited === undefined ? '' : group(outcomesVisited),
        formatSeconds(timing.secondsPerRun),
        benchCase.draws === undefined ? '' : group(benchCase.draws / timing.secondsPerRun),
      ];
    });
    console.log('## Exact multinomial test\n');
    console.log(table(['case', 'method', 'p', 'outcomes visited', 'time per run', 'draws per second'], rows));
    console.log('');
  }
  const analyzeRows = analyzeCases.map((benchCase) => {
    const timing = time(() => runAnalyzeCase(benchCase));
    return [benchCase.name, formatSeconds(timing.secondsPerRun), group(1 / timing.secondsPerRun)];
  });
  console.log('## analyze\n');
  console.log(table(['case', 'time per call', 'calls per second'], analyzeRows));
  console.log('');
  const boundedRows = boundedWorkCases.map((benchCase) => [benchCase.name, formatSeconds(time(benchCase.run).secondsPerRun)]);
  console.log('## Work bounded by the input (huge n, tiny shares)\n');
  console.log(table(['case', 'time per call'], boundedRows));
}

main();
