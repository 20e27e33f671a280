// Entry for the dataset scan worker when running from source (tests, benchmarks without a build):
// loads apps/api/src/dataset-scan-worker.ts through tsx with the workspace's path aliases. The
// server uses the built dist/apps/api/dataset-scan-worker.js instead.
const { join } = require('node:path');
process.env.TSX_TSCONFIG_PATH = join(__dirname, '../../../../tsconfig.base.json');
require('tsx/cjs/api').register();
module.exports = require('../dataset-scan-worker.ts');
