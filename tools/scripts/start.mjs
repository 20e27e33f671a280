#!/usr/bin/env node
// `npm start`: build the API and the console, then serve both on one port. The server migrates
// the database, seeds the demo people and analyses on first start, and prints the URL and sign-ins.
import { spawn, spawnSync } from 'node:child_process';

const root = new URL('../..', import.meta.url).pathname;
const build = spawnSync('npx', ['nx', 'run-many', '-t', 'build', '-p', 'api', 'console', '--outputStyle=static'], {
  cwd: root,
  stdio: 'inherit',
});
if (build.status !== 0) process.exit(build.status ?? 1);

const server = spawn(process.execPath, ['dist/apps/api/main.js'], { cwd: root, stdio: 'inherit' });
for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, () => server.kill(signal));
server.on('exit', (code) => process.exit(code ?? 0));
