import type { Knex } from 'knex';

/**
 * The lease of each scheduled pull: one row per watch and scheduled time. Every server fires the
 * schedule, but only the one whose insert wins the unique (watch_id, tick_time) runs the pull, so
 * with several servers on one database a tick runs exactly once. The row then records the outcome.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('watch_pull_ticks', (table) => {
    table.increments('id').primary();
    table.integer('watch_id').notNullable().references('id').inTable('watches');
    // ISO 8601 text in UTC, so both databases compare the same key.
    table.string('tick_time', 32).notNullable();
    table.string('claimed_by', 100).notNullable();
    table.timestamp('claimed_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.timestamp('finished_at', { useTz: true });
    table.string('outcome', 10);
    table.text('error');
    table.integer('batch_id').references('id').inTable('watch_batches');
    table.unique(['watch_id', 'tick_time']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('watch_pull_ticks');
}
