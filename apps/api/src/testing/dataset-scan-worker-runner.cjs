// Entry for the dataset scan worker when running from source (tests, benchmarks without a build):
// bundles apps/api/src/dataset-scan-worker.ts with esbuild, as the build does, and loads the bundle,
// so a thread carries the small scanner and not a TypeScript loader. The server uses the built
// dist/apps/api/dataset-scan-worker.js instead.
const { rmSync } = require('node:fs');
const { tmpdir } = require('node:os');
const { join } = require('node:path');
const { threadId } = require('node:worker_threads');
const { buildSync } = require('esbuild');

const bundle = join(tmpdir(), `tallyfit-scan-worker-${process.pid}-${threadId}.cjs`);
buildSync({
  entryPoints: [join(__dirname, '../dataset-scan-worker.ts')],
  bundle: true,
  platform: 'node',
  format: 'cjs',
  target: 'node20',
  tsconfig: join(__dirname, '../../../../tsconfig.base.json'),
  outfile: bundle,
  logLevel: 'error',
});
try {
  module.exports = require(bundle);
} finally {
  rmSync(bundle, { force: true });
}
