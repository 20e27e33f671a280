/**
 * History query at scale: seeds 100 000 analyses (invented counts, spread over two years, 60
 * studies, 40 authors) into a fresh SQLite database, then times GET /api/v1/analyses through the
 * real app for the sorts and filters the history page offers, as each kind of reader.
 *
 *   npx tsx --tsconfig tsconfig.base.json tools/bench/api/history.bench.ts [rows]
 *
 * Prints one table: median and 95th-percentile latency per query over repeated calls, and the
 * total the query matched. Seeding writes the rows directly (not through the engine), with the
 * derived columns the list filters on filled in as the service would.
 */
import { mkdtempSync, rmSync, statSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import pino from 'pino';
import { analyze, type AnalysisSpec } from '@tallyfit/engine';
import { signAccessToken } from '../../../apps/api/src/app/auth/access-token';
import { createUser } from '../../../apps/api/src/app/identity/users.service';
import { loadConfig } from '../../../apps/api/src/app/config';
import { createApp } from '../../../apps/api/src/app/create-app';
import { migrateToLatest, openDatabase } from '../../../apps/api/src/app/database';
import { inProcessEngine } from '../../../apps/api/src/app/engine/engine-runner';
import type { Knex } from 'knex';
import type { User } from '@tallyfit/contracts';

const ROWS = Number(process.argv[2] ?? 100_000);
const STUDIES = 60;
const ANALYSTS = 40;
const REPEATS = 40;
const BATCH = 500;

/** A small deterministic generator, so every run seeds the same data. */
function random(seed: number) {
  let state = seed >>> 0;
  return () => {
    state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
    return state / 2 ** 32;
  };
}

const sqliteTime = (date: Date) => date.toISOString().slice(0, 19).replace('T', ' ');

async function seed(db: Knex): Promise<{ admin: User; lead: User; analyst: User; viewer: User }> {
  const password = 'bench password, not used';
  const admin = await createUser(db, { email: 'admin@bench.local', name: 'Bench admin', role: 'admin', password });
  const lead = await createUser(db, { email: 'lead@bench.local', name: 'Bench lead', role: 'lead', password });
  const viewer = await createUser(db, { email: 'viewer@bench.local', name: 'Bench viewer', role: 'viewer', password });
  const analysts: User[] = [];
  for (let i = 0; i < ANALYSTS; i += 1) {
    analysts.push(await createUser(db, { email: `analyst${i}@bench.local`, name: `Analyst ${String(i).padStart(2, '0')}`, role: 'analyst', password }));
  }
  const studyIds: number[] = [];
  for (let i = 0; i < STUDIES; i += 1) {
    const [row] = await db('studies').insert({ name: `Study ${String(i).padStart(2, '0')}`, created_by: admin.id }).returning('id');
    studyIds.push(typeof row === 'object' ? row.id : row);
  }
  // Each analyst belongs to 5 studies; the viewer reads 3.
  const members: Array<{ study_id: number; user_id: number; study_role: string }> = [];
  analysts.forEach((analyst, i) => {
    for (let j = 0; j < 5; j += 1) members.push({ study_id: studyIds[(i * 3 + j) % STUDIES], user_id: analyst.id, study_role: 'contributor' });
  });
  for (let j = 0; j < 3; j += 1) members.push({ study_id: studyIds[j], user_id: viewer.id, study_role: 'reader' });
  await db.batchInsert('study_members', members, BATCH);

  // One real spec and result, stored on every row so rows have a realistic size.
  const spec: AnalysisSpec = { observed: { labels: ['control', 'variant'], counts: [5012, 4950] }, hypothesis: { kind: 'equal' } };
  const specJson = JSON.stringify(spec);
  const resultJson = JSON.stringify(analyze(spec));
  const next = random(20261202);
  const start = Date.now() - 2 * 365 * 86_400_000;
  const statuses = ['draft', 'draft', 'in_review', 'signed_off', 'returned'];
  const words = ['traffic split', 'panel make-up', 'defect mix', 'weekday load', 'first digits', 'colour ratio'];
  await db.transaction(async (trx) => {
    for (let offset = 0; offset < ROWS; offset += BATCH) {
      const rows = [];
      for (let i = offset; i < Math.min(ROWS, offset + BATCH); i += 1) {
        const p = next() ** 3;
        const author = analysts[Math.floor(next() * ANALYSTS)];
        const noStudy = next() < 0.05;
        rows.push({
          title: `${words[i % words.length]} check ${i}`,
          notes: next() < 0.3 ? `follow-up on ${words[(i + 1) % words.length]}` : null,
          author_id: author.id,
          study_id: noStudy ? null : studyIds[Math.floor(next() * STUDIES)],
          hypothesis_kind: 'equal',
          n: 9962,
          k: 2,
          p,
          alpha: 0.05,
          significant: p < 0.05,
          tests_run: next() < 0.2 ? ',pearson,g,exact,' : ',pearson,g,',
          status: statuses[Math.floor(next() * statuses.length)],
          spec_json: specJson,
          result_json: resultJson,
          engine_version: '0.1.0',
          version: 1,
          is_latest: true,
          created_at: sqliteTime(new Date(start + (i / ROWS) * 2 * 365 * 86_400_000)),
        });
      }
      await trx('analyses').insert(rows);
    }
    await trx('analyses').update({ series_id: trx.ref('id'), updated_at: trx.ref('created_at') });
  });
  return { admin, lead, analyst: analysts[0], viewer };
}

function percentile(sorted: number[], fraction: number): number {
  return sorted[Math.min(sorted.length - 1, Math.ceil(fraction * sorted.length) - 1)];
}

async function main(): Promise<void> {
  const dataDir = mkdtempSync(join(tmpdir(), 'tallyfit-history-bench-'));
  const config = loadConfig({ TALLYFIT_DATA_DIR: dataDir, JWT_SECRET: 'bench-secret', TALLYFIT_CONSOLE_DIR: join(dataDir, 'none') });
  const db = openDatabase(config);
  const engine = inProcessEngine();
  try {
    await migrateToLatest(db);
    const seedStart = performance.now();
    const people = await seed(db);
    const seedSeconds = (performance.now() - seedStart) / 1000;
    const { app, watches } = createApp({ config, db, engine, mail: undefined as never, logger: pino({ level: 'silent' }) });
    const server = app.listen(0, '127.0.0.1');
    await new Promise((resolve) => server.once('listening', resolve));
    const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}/api/v1/analyses`;
    const token = (user: User) => signAccessToken(user, config.jwtSecret, 3600);

    const cases: Array<[string, User, string]> = [
      ['admin: newest first (page 1 of 25)', people.admin, ''],
      ['admin: page 2000 (deep offset)', people.admin, '?page=2000'],
      ['lead: sort by p, ascending', people.lead, '?sort=p&order=asc'],
      ['lead: sort by study', people.lead, '?sort=study&order=asc'],
      ['lead: sort by author', people.lead, '?sort=author'],
      ['lead: sort by status', people.lead, '?sort=status'],
      ['lead: one study', people.lead, '?studyId=7'],
      ['lead: one author', people.lead, '?author=10'],
      ['lead: significant, signed off', people.lead, '?significant=true&status=signed_off'],
      ['lead: exact test run', people.lead, '?test=exact'],
      ['lead: last 30 days', people.lead, `?from=${new Date(Date.now() - 30 * 86_400_000).toISOString()}`],
      ['lead: free text "defect"', people.lead, '?q=defect'],
      ['lead: page size 100', people.lead, '?pageSize=100'],
      ['analyst (5 studies + own): newest', people.analyst, ''],
      ['analyst: own only (author=me)', people.analyst, '?author=me'],
      ['viewer (3 studies): newest', people.viewer, ''],
    ];

    const table: Array<{ query: string; matched: number; median: number; p95: number }> = [];
    for (const [name, user, query] of cases) {
      const headers = { Authorization: `Bearer ${token(user)}` };
      const times: number[] = [];
      let matched = 0;
      for (let i = 0; i < REPEATS + 3; i += 1) {
        const started = performance.now();
        const response = await fetch(base + query, { headers });
        const body = (await response.json()) as { total: number };
        if (!response.ok) throw new Error(`${name}: HTTP ${response.status} ${JSON.stringify(body)}`);
        if (i >= 3) times.push(performance.now() - started); // the first calls warm caches
        matched = body.total;
      }
      times.sort((a, b) => a - b);
      table.push({ query: name, matched, median: percentile(times, 0.5), p95: percentile(times, 0.95) });
    }
    server.close();
    await watches.stop();

    const dbFile = join(dataDir, 'tallyfit.sqlite');
    process.stdout.write(
      `\nHistory query, ${ROWS.toLocaleString('en-US')} analyses in SQLite (${(statSync(dbFile).size / 1e6).toFixed(0)} MB, seeded in ${seedSeconds.toFixed(1)} s); ` +
        `GET /api/v1/analyses over loopback, ${REPEATS} calls each\n\n`,
    );
    const width = Math.max(...table.map((row) => row.query.length));
    process.stdout.write(`| ${'query'.padEnd(width)} | matched | median ms | p95 ms |\n| ${'-'.repeat(width)} | ------: | --------: | -----: |\n`);
    for (const row of table) {
      process.stdout.write(
        `| ${row.query.padEnd(width)} | ${String(row.matched).padStart(7)} | ${row.median.toFixed(1).padStart(9)} | ${row.p95.toFixed(1).padStart(6)} |\n`,
      );
    }
  } finally {
    await engine.close();
    await db.destroy();
    rmSync(dataDir, { recursive: true, force: true });
  }
}

main().catch((error: unknown) => {
  process.stderr.write(`history bench failed: ${error instanceof Error ? error.stack : String(error)}\n`);
  process.exitCode = 1;
});
