import type { Knex } from 'knex';

/**
 * Uploaded datasets: the file's facts (name, size, checksum), what the upload learnt (columns,
 * a preview, offered counts) and the counts chosen last. The file itself is kept in the data
 * folder so other columns can be counted later; deleting a dataset removes the file but keeps
 * the row (marked deleted) so analyses still say which data they ran on.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('datasets', (table) => {
    table.increments('id').primary();
    table.integer('study_id').notNullable().references('id').inTable('studies');
    table.integer('uploaded_by').notNullable().references('id').inTable('users');
    table.string('file_name', 255).notNullable();
    table.string('kind', 8).notNullable();
    table.bigInteger('size_bytes').notNullable();
    table.string('sha256', 64).notNullable();
    table.bigInteger('row_count').notNullable();
    table.text('columns_json').notNullable();
    table.text('preview_json').notNullable();
    table.text('offered_json').notNullable();
    table.text('selected_json');
    // Relative to the data folder; null once the dataset is deleted.
    table.string('stored_file', 255);
    table.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.timestamp('deleted_at', { useTz: true });
    table.index(['study_id', 'created_at']);
  });
  await knex.schema.alterTable('analyses', (table) => {
    table.index(['dataset_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('analyses', (table) => {
    table.dropIndex(['dataset_id']);
  });
  await knex.schema.dropTable('datasets');
}
