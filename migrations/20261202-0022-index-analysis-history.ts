import type { Knex } from 'knex';

/**
 * One index holding every column the history filters and sorts on, so the count and the
 * choice of a page's ids are answered from the index alone, without reading the wide rows that
 * carry spec and result JSON. Measured with tools/bench/api/history.bench.ts.
 */
const COLUMNS = ['is_latest', 'deleted_at', 'created_at', 'study_id', 'author_id', 'p', 'status', 'significant', 'tests_run'];
const NAME = 'analyses_history_listing';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('analyses', (table) => {
    table.index(COLUMNS, NAME);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('analyses', (table) => {
    table.dropIndex(COLUMNS, NAME);
  });
}
