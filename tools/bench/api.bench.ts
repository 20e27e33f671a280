/**
 * `npm run bench:api`: the API under load on loopback, printed as one table.
 *
 * - requests per second and p99 latency, with autocannon for a fixed time, of the health route
 *   and of POST /api/v1/engine/analyze (Pearson + G, k = 10), on the built server
 *   (dist/apps/api/main.js, rebuilt first) with its engine worker pool;
 * - the history page's p95 with 100 000 analyses seeded (tools/bench/api/history.bench.ts);
 * - rows per second of a CSV upload (1 million rows; 10 million with --full) beside awk counting
 *   the same column of the same file.
 *
 * Options: --full (10 million rows), --seconds N (load time per route, default 10),
 * --skip-history, --skip-build (use the existing dist/apps/api).
 */
import { mkdtempSync, rmSync, statSync } from 'node:fs';
import { availableParallelism, tmpdir } from 'node:os';
import { join } from 'node:path';
import { buildApi, startBuiltServer } from './api/built-server';
import { timeHistory } from './api/history-row';
import { load, type LoadResult } from './api/http-load';
import { timeAwk, timeUpload, writeAssignmentsCsv } from './api/upload-rate';

const root = join(__dirname, '../..');
const args = process.argv.slice(2);
const full = args.includes('--full');
const secondsIndex = args.indexOf('--seconds');
const seconds = secondsIndex >= 0 ? Number(args[secondsIndex + 1]) : 10;
const uploadRows = full ? 10_000_000 : 1_000_000;
const CONNECTIONS = 10;

// Invented: a ten-way split of 5 000 page views.
const analyzeSpec = {
  observed: {
    labels: ['v1', 'v2', 'v3', 'v4', 'v5', 'v6', 'v7', 'v8', 'v9', 'v10'],
    counts: [512, 488, 530, 470, 505, 495, 520, 480, 499, 501],
  },
  hypothesis: { kind: 'equal' },
  tests: ['pearson', 'g'],
};

type Row = [measure: string, value: string, note: string];

const perSecond = (value: number) => Math.round(value).toLocaleString('en-US');
const loadRow = (name: string, result: LoadResult): Row[] => [
  [`${name}: requests per second`, perSecond(result.requestsPerSecond), `${CONNECTIONS} connections, ${seconds} s`],
  [`${name}: p99 latency`, `${result.p99Ms.toFixed(1)} ms`, result.errors || result.non2xx ? `${result.errors} errors, ${result.non2xx} non-2xx` : 'no errors'],
];

async function main(): Promise<void> {
  const rows: Row[] = [];
  if (!args.includes('--skip-build')) {
    process.stderr.write('building the API…\n');
    buildApi(root);
  }
  const server = await startBuiltServer(root);
  const scratch = mkdtempSync(join(tmpdir(), 'tallyfit-upload-bench-'));
  try {
    const token = await server.token('admin');
    process.stderr.write('load on the health route…\n');
    rows.push(...loadRow('GET /api/v1/health', await load({ url: `${server.baseUrl}/api/v1/health`, seconds, connections: CONNECTIONS })));
    process.stderr.write('load on the engine route…\n');
    rows.push(
      ...loadRow(
        'POST /api/v1/engine/analyze (Pearson + G, k = 10)',
        await load({
          url: `${server.baseUrl}/api/v1/engine/analyze`,
          method: 'POST',
          headers: { authorization: `Bearer ${token}`, 'content-type': 'application/json' },
          body: JSON.stringify(analyzeSpec),
          seconds,
          connections: CONNECTIONS,
        }),
      ),
    );

    process.stderr.write(`writing a ${uploadRows.toLocaleString('en-US')}-row CSV…\n`);
    const csv = await writeAssignmentsCsv(scratch, uploadRows);
    const megabytes = statSync(csv).size / 1024 ** 2;
    const study = await fetch(`${server.baseUrl}/api/v1/studies`, {
      method: 'POST',
      headers: { authorization: `Bearer ${token}`, 'content-type': 'application/json' },
      body: JSON.stringify({ name: 'Upload benchmark' }),
    });
    const studyId = ((await study.json()) as { id: number }).id;
    process.stderr.write('uploading it…\n');
    const upload = await timeUpload(server.baseUrl, token, studyId, csv);
    if (upload.rowCount !== uploadRows) throw new Error(`the upload counted ${upload.rowCount} rows, not ${uploadRows}`);
    const awkSeconds = timeAwk(csv);
    const size = `${uploadRows.toLocaleString('en-US')} rows, ${megabytes.toFixed(0)} MB${full ? '' : ' (10 million with --full)'}`;
    rows.push(
      ['CSV upload, counting one column: rows per second', perSecond(uploadRows / upload.seconds), `${size}; ${upload.seconds.toFixed(1)} s from first byte sent to the stored dataset`],
      ['awk counting the same column: rows per second', perSecond(uploadRows / awkSeconds), `same file; ${awkSeconds.toFixed(1)} s`],
    );
  } finally {
    await server.stop();
    rmSync(scratch, { recursive: true, force: true });
  }

  if (!args.includes('--skip-history')) {
    process.stderr.write('seeding 100 000 analyses and timing the history page…\n');
    const history = timeHistory(root, 100_000);
    if (typeof history === 'string') rows.push(['history page p95 (100 000 analyses)', '—', history]);
    else {
      rows.push(
        ['history page p95, newest first (100 000 analyses)', `${history.newestFirstP95Ms.toFixed(1)} ms`, 'GET /api/v1/analyses as an admin, in-process engine'],
        ['history page p95, slowest query of the history bench', `${history.slowestP95Ms.toFixed(1)} ms`, history.slowestQuery],
      );
    }
  }

  const widths = [0, 1, 2].map((i) => Math.max(['measure', 'value', 'note'][i].length, ...rows.map((row) => row[i].length)));
  const line = (cells: string[]) => `| ${cells.map((cell, i) => (i === 1 ? cell.padStart(widths[i]) : cell.padEnd(widths[i]))).join(' | ')} |`;
  process.stdout.write(`\nTallyfit API benchmark (node ${process.version}, ${availableParallelism()} cores, loopback)\n\n`);
  process.stdout.write([line(['measure', 'value', 'note']), `| ${widths.map((w, i) => (i === 1 ? '-'.repeat(w - 1) + ':' : '-'.repeat(w))).join(' | ')} |`, ...rows.map(line)].join('\n') + '\n');
}

main().catch((error: unknown) => {
  process.stderr.write(`api benchmark failed: ${error instanceof Error ? error.message : String(error)}\n`);
  process.exitCode = 1;
});
