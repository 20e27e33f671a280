import type { Knex } from 'knex';
import * as createUsers from './20261202-0001-create-users';
import * as createAnalyses from './20261202-0002-create-analyses';
import * as createStudies from './20261202-0003-create-studies';
import * as createAuditEvents from './20261202-0004-create-audit-events';
import * as extendAnalyses from './20261202-0005-extend-analyses';
import * as createReviewsAndComments from './20261202-0006-create-reviews-and-comments';
import * as createApiAndRefreshTokens from './20261202-0007-create-api-and-refresh-tokens';
import * as createDatasets from './20261202-0020-create-datasets';
import * as createShares from './20261202-0021-create-shares';
import * as indexAnalysisHistory from './20261202-0022-index-analysis-history';
import * as addAnalysisSegments from './20261202-0023-add-analysis-segments';
import * as createNotifications from './20261202-0030-create-notifications';
import * as createSourceConnections from './20261202-0040-create-source-connections';
import * as createWatches from './20261202-0041-create-watches';
import * as createWatchBatches from './20261202-0042-create-watch-batches';
import * as createWatchAlerts from './20261202-0043-create-watch-alerts';
import * as createWatchPullTicks from './20261202-0044-create-watch-pull-ticks';
import * as sessionsAndSignInAttempts from './20261202-0050-sessions-and-sign-in-attempts';

interface Migration {
  up(knex: Knex): Promise<void>;
  down(knex: Knex): Promise<void>;
}

/**
 * Every migration, in order. A static list (rather than a folder Knex scans) so the bundled
 * server and ts-jest resolve the same modules without a TypeScript loader at run time.
 */
const migrations: ReadonlyArray<readonly [name: string, migration: Migration]> = [
  ['20261202-0001-create-users', createUsers],
  ['20261202-0002-create-analyses', createAnalyses],
  ['20261202-0003-create-studies', createStudies],
  ['20261202-0004-create-audit-events', createAuditEvents],
  ['20261202-0005-extend-analyses', extendAnalyses],
  ['20261202-0006-create-reviews-and-comments', createReviewsAndComments],
  ['20261202-0007-create-api-and-refresh-tokens', createApiAndRefreshTokens],
  ['20261202-0020-create-datasets', createDatasets],
  ['20261202-0021-create-shares', createShares],
  ['20261202-0022-index-analysis-history', indexAnalysisHistory],
  ['20261202-0023-add-analysis-segments', addAnalysisSegments],
  ['20261202-0030-create-notifications', createNotifications],
  ['20261202-0040-create-source-connections', createSourceConnections],
  ['20261202-0041-create-watches', createWatches],
  ['20261202-0042-create-watch-batches', createWatchBatches],
  ['20261202-0043-create-watch-alerts', createWatchAlerts],
  ['20261202-0044-create-watch-pull-ticks', createWatchPullTicks],
  ['20261202-0050-sessions-and-sign-in-attempts', sessionsAndSignInAttempts],
];

export const migrationSource: Knex.MigrationSource<Migration> = {
  getMigrations: async () => migrations.map(([, migration]) => migration),
  getMigrationName: (migration) => {
    const entry = migrations.find(([, candidate]) => candidate === migration);
    if (!entry) throw new Error('unknown migration');
    return entry[0];
  },
  getMigration: async (migration) => migration,
};

export const migrationNames = migrations.map(([name]) => name);
