/**
 * The history row of the API benchmark comes from the history timing script beside this file
 * (history.bench.ts seeds 100 000 analyses and times the history page's queries). It runs as its
 * own process, and its table is read back for the newest-first page and the slowest query.
 */
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { join } from 'node:path';

export interface HistoryTiming {
  rows: number;
  newestFirstP95Ms: number;
  slowestQuery: string;
  slowestP95Ms: number;
}

export function timeHistory(root: string, rows: number): HistoryTiming | string {
  const script = join(root, 'tools/bench/api/history.bench.ts');
  if (!existsSync(script)) return 'history timing script (tools/bench/api/history.bench.ts) not found';
  const run = spawnSync(join(root, 'node_modules/.bin/tsx'), ['--tsconfig', join(root, 'tsconfig.base.json'), script, String(rows)], {
    cwd: root,
    encoding: 'utf8',
    maxBuffer: 16 * 1024 * 1024,
  });
  if (run.status !== 0) return `history timing script failed: ${(run.stderr || run.stdout).trim().split('\n').slice(-1)[0]}`;
  // Its rows read: | query | matched | median ms | p95 ms |
  const table = run.stdout
    .split('\n')
    .map((line) => line.split('|').map((cell) => cell.trim()))
    .filter((cells) => cells.length === 6 && /^\d+(\.\d+)?$/.test(cells[4]))
    .map((cells) => ({ query: cells[1], p95: Number(cells[4]) }));
  if (table.length === 0) return 'history timing script printed no table';
  const newest = table.find((row) => /newest first/.test(row.query)) ?? table[0];
  const slowest = table.reduce((worst, row) => (row.p95 > worst.p95 ? row : worst));
  return { rows, newestFirstP95Ms: newest.p95, slowestQuery: slowest.query, slowestP95Ms: slowest.p95 };
}
