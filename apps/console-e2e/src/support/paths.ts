import { join, resolve } from 'node:path';

export const WORKSPACE_ROOT = resolve(__dirname, '../../../..');
export const API_BUNDLE = join(WORKSPACE_ROOT, 'dist/apps/api/main.js');
export const CONSOLE_BUILD = join(WORKSPACE_ROOT, 'dist/apps/console/browser');
/** Screenshots land here so people can look at what the tests saw. */
export const SCREENSHOT_DIR = join(WORKSPACE_ROOT, 'test-output/e2e');
