/**
 * `npm run bench:ingest`: how fast a dataset is read, beside mawk on the same file in the same run.
 *
 * A CSV of invented sales events (`id,region,amount`, 10 million rows, about 176 MB; `--rows N`
 * for another size) is generated in a temporary folder, then each way of reading it runs in a
 * process of its own, best of three, with its peak resident memory (all threads):
 * - mawk counting the region column (`NR>1{c[$2]++} END{...}`), the yardstick;
 * - ours: counting the column (two worker threads, and one thread), counting by two columns at once
 *   (amount split by region, as segments need), and the whole upload path (profile every column,
 *   count the chosen one, checksum, store); warm (as on a running server: threads started, code
 *   compiled, by one untimed run first) and cold (the first run of a fresh process);
 * - alternatives measured: csv-parse (the parser used before) and DuckDB's CSV reader (two threads);
 * - TSV and XLSX: rows per second for a smaller file of each (XLSX 200 000 rows), beside CSV.
 * The API code is bundled with esbuild first, as the server runs it (the worker too).
 * Goals (issue 12): counting ≤ 1.0× mawk, upload path ≤ 2.0× mawk, peak memory ≤ 200 MB.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { build } from 'esbuild';
import ExcelJS from 'exceljs';
import { writeSalesFile } from './ingest/ingest-file';

const root = join(__dirname, '../..');
const args = process.argv.slice(2);
const rowsIndex = args.indexOf('--rows');
const rows = rowsIndex >= 0 ? Number(args[rowsIndex + 1]) : 10_000_000;
const XLSX_ROWS = 200_000;
const RUNS = 3;

interface Measure {
  seconds: number;
  peakRssMb: number;
  summary: unknown;
}

async function bundle(dir: string): Promise<{ child: string; worker: string }> {
  const common = { bundle: true, platform: 'node' as const, format: 'cjs' as const, target: 'node20', tsconfig: join(root, 'tsconfig.base.json'), logLevel: 'error' as const };
  const child = join(dir, 'scan-child.js');
  const worker = join(dir, 'dataset-scan-worker.js');
  await build({ ...common, entryPoints: [join(__dirname, 'ingest/scan-child.ts')], outfile: child, external: ['@duckdb/node-api', 'exceljs', 'piscina'] });
  await build({ ...common, entryPoints: [join(root, 'apps/api/src/dataset-scan-worker.ts')], outfile: worker });
  return { child, worker };
}

function best(runs: Measure[]): Measure {
  return runs.reduce((a, b) => (b.seconds < a.seconds ? b : a));
}

/** A run that failed is shown in the table with its error rather than stopping the others. */
function measureChild(child: string, mode: string, path: string, worker: string): Measure {
  const runs: Measure[] = [];
  for (let i = 0; i < RUNS; i++) {
    const run = spawnSync(process.execPath, [child, mode, path, worker], { env: { ...process.env, NODE_PATH: join(root, 'node_modules') }, encoding: 'utf8' });
    if (run.status !== 0) return { seconds: NaN, peakRssMb: 0, summary: `failed: ${run.stderr.trim().split('\n')[0]}` };
    runs.push(JSON.parse(run.stdout.trim().split('\n').at(-1)!) as Measure);
  }
  return best(runs);
}

/** mawk's wall time (a process start is all it adds to the work) and its peak memory. */
function measureMawk(path: string): Measure {
  const runs: Measure[] = [];
  const program = 'NR>1{c[$2]++} END{for(k in c) print k, c[k]}';
  for (let i = 0; i < RUNS; i++) {
    const started = performance.now();
    const out = execFileSync('mawk', ['-F,', program, path], { encoding: 'utf8' });
    const seconds = (performance.now() - started) / 1000;
    runs.push({ seconds, peakRssMb: 0, summary: out.trim().split('\n').reduce((sum, line) => sum + Number(line.split(' ')[1]), 0) });
  }
  // GNU time prints the peak resident set in kilobytes (%M) on stderr, when it is installed.
  const peak = spawnSync('/usr/bin/time', ['-f', '%M', 'mawk', '-F,', program, path], { encoding: 'utf8' });
  return { ...best(runs), peakRssMb: peak.status === 0 ? Number(peak.stderr.trim().split('\n').at(-1)) / 1024 : 0 };
}

function mawkAvailable(): boolean {
  return spawnSync('mawk', ['-W', 'version'], { stdio: 'ignore' }).status === 0;
}

async function writeXlsx(path: string, count: number): Promise<void> {
  const workbook = new ExcelJS.stream.xlsx.WorkbookWriter({ filename: path });
  const sheet = workbook.addWorksheet('sales');
  sheet.addRow(['id', 'region', 'amount']).commit();
  const regions = ['north', 'south', 'east', 'west', 'centre'];
  for (let i = 1; i <= count; i++) sheet.addRow([i, regions[(Math.imul(i, 2654435761) >>> 0) % 5], (i * 7919) % 1000]).commit();
  sheet.commit();
  await workbook.commit();
}

type Row = [what: string, seconds: string, ratio: string, memory: string, note: string];

async function main(): Promise<void> {
  if (!mawkAvailable()) throw new Error('mawk is not installed; install it with `apt-get install mawk` (a Debian package)');
  const dir = mkdtempSync(join(tmpdir(), 'tallyfit-ingest-bench-'));
  try {
    process.stderr.write(`generating ${rows.toLocaleString('en-US')} rows and bundling…\n`);
    const csv = join(dir, 'sales.csv');
    const tsv = join(dir, 'sales.tsv');
    const xlsx = join(dir, 'sales.xlsx');
    const smallCsv = join(dir, 'sales-small.csv');
    await writeSalesFile(csv, rows);
    await writeSalesFile(tsv, Math.min(rows, 1_000_000), '\t');
    await writeSalesFile(smallCsv, XLSX_ROWS);
    await writeXlsx(xlsx, XLSX_ROWS);
    const { child, worker } = await bundle(dir);
    const megabytes = statSync(csv).size / 1e6;

    process.stderr.write('measuring…\n');
    const mawk = measureMawk(csv);
    const ours = (mode: string, path = csv) => measureChild(child, mode, path, worker);
    const ratio = (m: Measure) => `${(m.seconds / mawk.seconds).toFixed(2)}×`;
    const memory = (m: Measure) => (m.peakRssMb ? `${m.peakRssMb.toFixed(0)} MB` : '—');
    const secs = (m: Measure) => m.seconds.toFixed(2);
    const line = (what: string, m: Measure, note: string): Row => [what, secs(m), ratio(m), memory(m), note];

    const count = ours('count-warm');
    const countCold = ours('count');
    const oneThread = ours('count-one-thread-warm');
    const twoColumns = ours('count-two-columns-warm');
    const upload = ours('upload-warm');
    const uploadCold = ours('upload');
    const csvParse = ours('csv-parse');
    const duckdb = ours('duckdb');
    const tsvCount = ours('count-warm', tsv);
    const smallCount = ours('count-warm', smallCsv);
    const xlsxCount = ours('count-warm', xlsx);
    const perRow = (m: Measure, n: number) => `${Math.round(n / m.seconds).toLocaleString('en-US')} rows/s`;

    const table: Row[] = [
      line('mawk: count the region column', mawk, `${rows.toLocaleString('en-US')} rows, ${megabytes.toFixed(0)} MB; the yardstick (goal for counting ≤ 1.0×)`),
      line('ours: count the region column (2 threads)', count, `goal ≤ 1.0×; ${String(count.summary)} rows counted`),
      line('ours: the same, first scan of a fresh process', countCold, 'includes starting the threads and compiling'),
      line('ours: count the region column (1 thread)', oneThread, 'the same scanner without the split'),
      line('ours: count by two columns (amount × region)', twoColumns, String(twoColumns.summary)),
      line('ours: upload path (profile all columns, count, checksum, store)', upload, `goal ≤ 2.0×; ${String(upload.summary)}`),
      line('ours: the same, first upload of a fresh process', uploadCold, 'includes starting the threads and compiling'),
      line('alternative: csv-parse, count the column', csvParse, 'the streaming parser used before, one thread'),
      line('alternative: DuckDB read_csv + GROUP BY (2 threads)', duckdb, '@duckdb/node-api'),
      line(`ours: TSV, ${Math.min(rows, 1_000_000).toLocaleString('en-US')} rows`, tsvCount, perRow(tsvCount, Math.min(rows, 1_000_000))),
      line(`ours: CSV, ${XLSX_ROWS.toLocaleString('en-US')} rows`, smallCount, perRow(smallCount, XLSX_ROWS)),
      line(`ours: XLSX, ${XLSX_ROWS.toLocaleString('en-US')} rows`, xlsxCount, `${perRow(xlsxCount, XLSX_ROWS)}, ${(xlsxCount.seconds / smallCount.seconds).toFixed(0)}× the same rows as CSV`),
    ];
    const head: Row = ['reading', 'seconds', '× mawk', 'peak memory', 'note'];
    const widths = head.map((_, i) => Math.max(head[i].length, ...table.map((row) => row[i].length)));
    const format = (row: Row) => `| ${row.map((cell, i) => (i === 1 || i === 2 || i === 3 ? cell.padStart(widths[i]) : cell.padEnd(widths[i]))).join(' | ')} |`;
    const rule = `|${widths.map((w, i) => (i >= 1 && i <= 3 ? '-'.repeat(w + 1) + ':' : '-'.repeat(w + 2))).join('|')}|`;
    process.stdout.write([format(head), rule, ...table.map(format)].join('\n') + '\n');
    process.stdout.write(`best of ${RUNS} runs each; seconds of work inside the measuring process (mawk: wall time of its process); peak memory is the process's maximum resident set, all threads.\n`);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

main().catch((error: unknown) => {
  process.stderr.write(`${error instanceof Error ? error.message : String(error)}\n`);
  process.exitCode = 1;
});
