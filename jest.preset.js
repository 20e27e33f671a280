const { mkdirSync } = require('node:fs');
const { join } = require('node:path');
const nxPreset = require('@nx/jest/preset').default;

// Every project's test target writes its JSON report here (for the totals line of `npm test`);
// Jest does not create the folder itself.
mkdirSync(join(__dirname, 'dist/test-reports'), { recursive: true });

module.exports = { ...nxPreset };
