/**
 * One measured run, in a process of its own so its peak memory is its own: counts, scans or
 * uploads the file as the API does, or counts it with an alternative reader, and prints
 * `{ seconds, peakRssMb, summary }` as JSON. Built by ingest.bench.ts with esbuild and run with node.
 *
 * Usage: node scan-child.js <mode>[-warm] <csv path> <worker file | "none">
 * With "-warm" the same work runs once untimed first, as on a running server whose scan threads
 * are started and whose code is compiled; without it the run is the process's first.
 */
import { linkSync, mkdirSync, renameSync, rmSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { countCategories, countSegments, scanTable } from '../../../apps/api/src/app/datasets/dataset-scan';
import { sha256OfFile } from '../../../apps/api/src/app/datasets/file-checksum';
import type { FileKind } from '../../../apps/api/src/app/datasets/file-kind';
import { countWithCsvParse, countWithDuckDb } from './alternatives';

type Mode = 'count' | 'count-one-thread' | 'count-two-columns' | 'upload' | 'csv-parse' | 'duckdb';

async function run(mode: Mode, path: string, workerFile: string | null): Promise<unknown> {
  const kind = (path.endsWith('.xlsx') ? 'xlsx' : path.endsWith('.tsv') ? 'tsv' : 'csv') as FileKind;
  switch (mode) {
    case 'count':
      return (await countCategories(path, kind, { shape: 'raw', column: 'region' }, { workerFile })).total;
    case 'count-one-thread':
      return (await countCategories(path, kind, { shape: 'raw', column: 'region' }, { workerFile: null })).total;
    case 'count-two-columns': {
      const counts = await countSegments(path, kind, { shape: 'raw', column: 'amount' }, 'region', { workerFile });
      return `${counts.labels.length} categories × ${counts.segments.length} segments, ${counts.total} rows`;
    }
    case 'upload': {
      // As createDataset does once multer has written the file: scan (profile + count) beside the
      // checksum, then move the file into the store.
      const received = join(dirname(path), `upload-${process.pid}`);
      linkSync(path, received);
      const [scan, sha256] = await Promise.all([scanTable(received, kind, { shape: 'raw', column: 'region' }, { workerFile }), sha256OfFile(received)]);
      const store = join(dirname(path), 'store');
      mkdirSync(store, { recursive: true });
      const stored = join(store, `${sha256.slice(0, 12)}-${basename(path)}`);
      renameSync(received, stored);
      rmSync(stored);
      return `${scan.rowCount} rows, ${scan.columns.length} columns profiled, ${scan.selectedCounts?.total} counted`;
    }
    case 'csv-parse':
      return countWithCsvParse(path, 'region');
    case 'duckdb':
      return countWithDuckDb(path, 'region');
  }
}

async function main(): Promise<void> {
  const [modeArg, path, worker] = process.argv.slice(2);
  const mode = modeArg.replace(/-warm$/, '') as Mode;
  const workerFile = worker === 'none' ? null : worker;
  if (modeArg.endsWith('-warm')) await run(mode, path, workerFile);
  const started = performance.now();
  const summary = await run(mode, path, workerFile);
  const seconds = (performance.now() - started) / 1000;
  // maxRSS is in kilobytes and covers every thread of this process.
  process.stdout.write(JSON.stringify({ seconds, peakRssMb: process.resourceUsage().maxRSS / 1024, summary }) + '\n');
  process.exit(0); // the scan threads stop when idle; the measurement is done
}

main().catch((error: unknown) => {
  process.stderr.write(`${error instanceof Error ? error.stack : String(error)}\n`);
  process.exit(1);
});
