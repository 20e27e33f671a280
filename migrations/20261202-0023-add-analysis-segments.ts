import type { Knex } from 'knex';

/**
 * An analysis of a dataset may also be split by a second column: the column's name and the
 * engine's segment result (ranked table, adjusted p-values, write-up) are kept with the analysis.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('analyses', (table) => {
    table.string('segment_column', 200).nullable();
    table.text('segments_json').nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('analyses', (table) => {
    table.dropColumn('segments_json');
    table.dropColumn('segment_column');
  });
}
