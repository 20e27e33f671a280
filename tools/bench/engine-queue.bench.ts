/**
 * `npm run bench:queue`: does one person's pile of long exact runs stall everyone else?
 *
 * On the built server (dist/apps/api/main.js, rebuilt first) with its engine worker pool, this
 * measures another person's Pearson analysis (POST /api/v1/engine/analyze, 50 in a row) and the
 * health route (200 in a row) twice in the same run: first with the engine idle, then while the
 * demo analyst has 20 long exact runs queued. The targets: Pearson p99 under 1 s and health p99
 * under 50 ms while the long runs wait. It also counts how the long runs ended.
 *
 * Options: --skip-build (use the existing dist/apps/api).
 */
import { availableParallelism } from 'node:os';
import { join } from 'node:path';
import { buildApi, startBuiltServer, type BuiltServer } from './api/built-server';

const root = join(__dirname, '../..');
const args = process.argv.slice(2);
const LONG_RUNS = 20;
const PEARSON_CALLS = 50;
const HEALTH_CALLS = 200;

// Invented: a three-way split of 120 sign-ups, Pearson only.
const pearsonSpec = {
  observed: { labels: ['north', 'south', 'west'], counts: [46, 38, 36] },
  hypothesis: { kind: 'equal' },
  tests: ['pearson'],
};
// Invented: six categories and the most Monte Carlo draws the API accepts, so each run uses its whole time limit.
const longSpec = {
  observed: { labels: ['a', 'b', 'c', 'd', 'e', 'f'], counts: [310, 295, 330, 280, 305, 320] },
  hypothesis: { kind: 'equal' },
  tests: ['exact'],
  exact: { method: 'monte-carlo', samples: 100_000_000, seed: 11 },
};

type Row = [measure: string, idle: string, busy: string, target: string];

function percentile(sorted: number[], q: number): number {
  return sorted[Math.min(sorted.length - 1, Math.ceil(q * sorted.length) - 1)];
}

async function timed(call: () => Promise<Response>): Promise<number> {
  const started = performance.now();
  const response = await call();
  await response.arrayBuffer();
  if (!response.ok) throw new Error(`HTTP ${response.status} during the benchmark`);
  return performance.now() - started;
}

async function latencies(times: number, call: () => Promise<Response>): Promise<{ p50: number; p99: number; max: number }> {
  const all: number[] = [];
  for (let i = 0; i < times; i++) all.push(await timed(call));
  all.sort((a, b) => a - b);
  return { p50: percentile(all, 0.5), p99: percentile(all, 0.99), max: all[all.length - 1] };
}

async function measure(server: BuiltServer, viewerToken: string) {
  const pearson = await latencies(PEARSON_CALLS, () =>
    fetch(`${server.baseUrl}/api/v1/engine/analyze`, {
      method: 'POST',
      headers: { authorization: `Bearer ${viewerToken}`, 'content-type': 'application/json' },
      body: JSON.stringify(pearsonSpec),
    }),
  );
  const health = await latencies(HEALTH_CALLS, () => fetch(`${server.baseUrl}/api/v1/health`));
  return { pearson, health };
}

const ms = (value: number) => `${value.toFixed(1)} ms`;

async function main(): Promise<void> {
  if (!args.includes('--skip-build')) {
    process.stderr.write('building the API…\n');
    buildApi(root);
  }
  const server = await startBuiltServer(root);
  try {
    const analystToken = await server.token('analyst');
    const viewerToken = await server.token('viewer');
    process.stderr.write('measuring with the engine idle…\n');
    await measure(server, viewerToken); // warm-up: worker threads, JIT, database pages
    const idle = await measure(server, viewerToken);

    process.stderr.write(`queueing ${LONG_RUNS} long exact runs as the analyst…\n`);
    const endings = new Map<string, number>();
    const longRuns = Array.from({ length: LONG_RUNS }, async () => {
      const response = await fetch(`${server.baseUrl}/api/v1/engine/analyze`, {
        method: 'POST',
        headers: { authorization: `Bearer ${analystToken}`, 'content-type': 'application/json' },
        body: JSON.stringify(longSpec),
      });
      const body = (await response.json()) as { error?: { code: string } };
      const ending = `${response.status} ${body.error?.code ?? 'ok'}`;
      endings.set(ending, (endings.get(ending) ?? 0) + 1);
    });
    await new Promise((resolve) => setTimeout(resolve, 500)); // let them reach the queue
    process.stderr.write('measuring while they wait…\n');
    const busy = await measure(server, viewerToken);
    process.stderr.write('waiting for the long runs to end…\n');
    await Promise.all(longRuns);

    const rows: Row[] = [
      [`Pearson analysis (another person), p50 of ${PEARSON_CALLS}`, ms(idle.pearson.p50), ms(busy.pearson.p50), ''],
      [`Pearson analysis (another person), p99 of ${PEARSON_CALLS}`, ms(idle.pearson.p99), ms(busy.pearson.p99), '< 1000 ms'],
      [`GET /api/v1/health, p50 of ${HEALTH_CALLS}`, ms(idle.health.p50), ms(busy.health.p50), ''],
      [`GET /api/v1/health, p99 of ${HEALTH_CALLS}`, ms(idle.health.p99), ms(busy.health.p99), '< 50 ms'],
    ];
    const headers: Row = ['measure', 'engine idle', `${LONG_RUNS} long runs queued`, 'target'];
    const widths = [0, 1, 2, 3].map((i) => Math.max(headers[i].length, ...rows.map((row) => row[i].length)));
    const line = (cells: string[]) => `| ${cells.map((cell, i) => (i === 0 ? cell.padEnd(widths[i]) : cell.padStart(widths[i]))).join(' | ')} |`;
    const rule = `| ${widths.map((w, i) => (i === 0 ? '-'.repeat(w) : '-'.repeat(w - 1) + ':')).join(' | ')} |`;
    process.stdout.write(`\nTallyfit engine queue benchmark (node ${process.version}, ${availableParallelism()} cores, loopback, built server)\n\n`);
    process.stdout.write([line(headers), rule, ...rows.map(line)].join('\n') + '\n');
    const ended = [...endings].sort().map(([ending, count]) => `${count} × ${ending}`).join(', ');
    process.stdout.write(`\nThe ${LONG_RUNS} long runs ended: ${ended}\n`);
  } finally {
    await server.stop();
  }
}

main().catch((error: unknown) => {
  process.stderr.write(`engine queue benchmark failed: ${error instanceof Error ? error.message : String(error)}\n`);
  process.exitCode = 1;
});
