import type { Knex } from 'knex';

/**
 * Analyses join studies, remember their dataset, carry a review status and a version chain
 * (re-runs add a version to the same series), can be soft-deleted, and keep the columns the
 * history page filters and sorts on.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('analyses', (table) => {
    // Nullable: analyses stored before studies existed belong to no study.
    table.integer('study_id').references('id').inTable('studies');
    // The datasets table and its foreign key arrive with the datasets migration.
    table.integer('dataset_id');
    table.text('notes');
    table.string('status', 16).notNullable().defaultTo('draft');
    table.integer('series_id');
    table.integer('version').notNullable().defaultTo(1);
    table.integer('previous_id');
    table.boolean('is_latest').notNullable().defaultTo(true);
    table.string('tests_run', 64).notNullable().defaultTo('');
    table.double('alpha').notNullable().defaultTo(0.05);
    table.boolean('significant');
    table.timestamp('updated_at', { useTz: true });
    table.timestamp('deleted_at', { useTz: true });
    table.integer('deleted_by');
  });
  await knex('analyses').update({ series_id: knex.ref('id'), updated_at: knex.ref('created_at') });
  await knex.schema.alterTable('analyses', (table) => {
    table.index(['study_id', 'created_at']);
    table.index(['series_id', 'version']);
    table.index(['status', 'created_at']);
    table.index(['p']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('analyses', (table) => {
    table.dropIndex(['study_id', 'created_at']);
    table.dropIndex(['series_id', 'version']);
    table.dropIndex(['status', 'created_at']);
    table.dropIndex(['p']);
  });
  await knex.schema.alterTable('analyses', (table) => {
    for (const column of [
      'study_id', 'dataset_id', 'notes', 'status', 'series_id', 'version', 'previous_id', 'is_latest',
      'tests_run', 'alpha', 'significant', 'updated_at', 'deleted_at', 'deleted_by',
    ]) {
      table.dropColumn(column);
    }
  });
}
