import type { Knex } from 'knex';

/**
 * Alerts (a watch going into alarm or back to holding) and their deliveries: one row per e-mail
 * recipient or webhook, retried with back-off until delivered or out of attempts. A delivery is
 * claimed for a while before it is tried, so two servers never send the same one together.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('watch_alerts', (table) => {
    table.increments('id').primary();
    table.integer('watch_id').notNullable().references('id').inTable('watches');
    table.string('kind', 8).notNullable();
    // Null when a restart (not a batch) cleared the alarm.
    table.integer('batch_id').references('id').inTable('watch_batches');
    table.double('sequential_p').notNullable();
    table.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.integer('acknowledged_by').references('id').inTable('users');
    table.timestamp('acknowledged_at', { useTz: true });
    table.text('note');
    table.index(['watch_id', 'created_at']);
  });
  await knex.schema.createTable('alert_deliveries', (table) => {
    table.increments('id').primary();
    table.integer('alert_id').notNullable().references('id').inTable('watch_alerts');
    table.string('channel', 8).notNullable();
    table.string('target', 2000).notNullable();
    table.text('payload_json').notNullable();
    table.string('status', 10).notNullable();
    table.integer('attempts').notNullable().defaultTo(0);
    table.text('last_error');
    table.timestamp('next_attempt_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.timestamp('claimed_until', { useTz: true });
    table.timestamp('delivered_at', { useTz: true });
    table.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.index(['alert_id']);
    table.index(['status', 'next_attempt_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('alert_deliveries');
  await knex.schema.dropTable('watch_alerts');
}
