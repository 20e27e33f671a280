#!/usr/bin/env node
// `npm test`: lint, type checks, unit and API tests, component tests, then the browser tests,
// and a closing totals line summed from every Jest runner's JSON report.
import { spawnSync } from 'node:child_process';
import { existsSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { ensureChromium } from './ensure-chromium.mjs';

const root = new URL('../..', import.meta.url).pathname;
const reports = join(root, 'dist/test-reports');
rmSync(reports, { recursive: true, force: true });

const { TALLYFIT_TEST_POSTGRES_URL: postgresUrl, ...embeddedEnv } = process.env;
const nxWith = (env, ...args) =>
  spawnSync('npx', ['nx', ...args, '--outputStyle=static'], { cwd: root, stdio: 'inherit', env }).status ?? 1;
// Everything runs on the embedded SQLite default unless a step asks for PostgreSQL.
const nx = (...args) => nxWith(embeddedEnv, ...args);

const failures = [];
if (nx('run-many', '-t', 'lint', 'typecheck', 'test', '--parallel=2') !== 0) failures.push('lint, type checks or unit tests');

// The API suites again on PostgreSQL, when a server is offered (.ci/run starts one): the same
// migrations and queries must hold on both databases.
if (postgresUrl) {
  const pgReport = 'dist/test-reports/api-postgres.json';
  const pgEnv = { ...embeddedEnv, TALLYFIT_TEST_POSTGRES_URL: postgresUrl };
  if (nxWith(pgEnv, 'run', 'api:test', '--skip-nx-cache', `--outputFile=${pgReport}`) !== 0) failures.push('API tests on PostgreSQL');
} else {
  console.log('\nAPI tests on PostgreSQL not run: set TALLYFIT_TEST_POSTGRES_URL to a server URL to run them.');
}

const chromium = ensureChromium();
if (!chromium.ok) {
  console.error(chromium.message);
  failures.push('browser tests (no Chromium)');
} else if (nx('run', 'console-e2e:e2e') !== 0) {
  failures.push('browser tests');
}

let passed = 0;
let failed = 0;
if (existsSync(reports)) {
  for (const file of readdirSync(reports).filter((name) => name.endsWith('.json'))) {
    const report = JSON.parse(readFileSync(join(reports, file), 'utf8'));
    passed += report.numPassedTests;
    failed += report.numFailedTests;
  }
}
if (failures.length) console.error(`\nFailed: ${failures.join('; ')}`);
console.log(`\n${passed} passed, ${failed} failed`);
process.exit(failures.length || failed ? 1 : 0);
