import type { Knex } from 'knex';

/** Review decisions (submitted, signed off, returned) and free comments on analyses. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('analysis_reviews', (table) => {
    table.increments('id').primary();
    table.integer('analysis_id').notNullable().references('id').inTable('analyses');
    table.integer('actor_id').notNullable().references('id').inTable('users');
    table.string('decision', 16).notNullable();
    table.text('comment');
    table.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.index(['analysis_id', 'created_at']);
  });
  await knex.schema.createTable('analysis_comments', (table) => {
    table.increments('id').primary();
    table.integer('analysis_id').notNullable().references('id').inTable('analyses');
    table.integer('author_id').notNullable().references('id').inTable('users');
    table.text('body').notNullable();
    table.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.index(['analysis_id', 'created_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('analysis_comments');
  await knex.schema.dropTable('analysis_reviews');
}
