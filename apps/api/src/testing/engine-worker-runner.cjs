// Test-only entry for the engine pool: lets a piscina thread load the TypeScript worker
// (apps/api/src/engine-worker.ts) through tsx, with the workspace's path aliases. The server
// uses the built dist/apps/api/engine-worker.js instead.
const { join } = require('node:path');
process.env.TSX_TSCONFIG_PATH = join(__dirname, '../../../../tsconfig.base.json');
require('tsx/cjs/api').register();
module.exports = require('../engine-worker.ts');
