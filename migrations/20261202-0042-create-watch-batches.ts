import type { Knex } from 'knex';

/**
 * Each batch a watch took in, with its own one-look analysis and the sequential test's look after
 * it. An idempotency key is unique per watch, so a retried push is counted once.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('watch_batches', (table) => {
    table.increments('id').primary();
    table.integer('watch_id').notNullable().references('id').inTable('watches');
    table.integer('sequence').notNullable();
    table.timestamp('period_start', { useTz: true }).notNullable();
    table.timestamp('period_end', { useTz: true }).notNullable();
    table.text('counts_json').notNullable();
    table.bigInteger('n').notNullable();
    table.string('idempotency_key', 200).notNullable();
    table.string('source', 8).notNullable();
    table.integer('dataset_id').references('id').inTable('datasets');
    table.integer('analysis_id').notNullable().references('id').inTable('analyses');
    table.double('batch_p');
    table.bigInteger('cumulative_n').notNullable();
    table.double('sequential_p').notNullable();
    table.double('log_bayes_factor').notNullable();
    table.boolean('alarm').notNullable();
    table.text('shares_json').notNullable();
    table.integer('created_by').references('id').inTable('users');
    table.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.unique(['watch_id', 'idempotency_key']);
    table.unique(['watch_id', 'sequence']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('watch_batches');
}
