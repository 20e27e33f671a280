import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('analyses', (table) => {
    table.increments('id').primary();
    table.string('title', 200).notNullable();
    table.integer('author_id').notNullable().references('id').inTable('users');
    table.string('hypothesis_kind', 32).notNullable();
    table.integer('n').notNullable();
    table.integer('k').notNullable();
    // The headline p-value (Pearson's, else the first test run), kept in a column for sorting and filtering.
    table.double('p');
    table.text('spec_json').notNullable();
    table.text('result_json').notNullable();
    table.string('engine_version', 32).notNullable();
    table.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.index(['author_id', 'created_at']);
    table.index(['created_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('analyses');
}
