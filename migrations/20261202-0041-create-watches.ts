import type { Knex } from 'knex';

/**
 * Watches: a hypothesis over fixed categories, a feed, and the running state of the sequential
 * test (kept as the engine's JSON state so each batch continues from the last). The webhook
 * secret is stored encrypted, like a connection's password, because it must be read to sign.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('watches', (table) => {
    table.increments('id').primary();
    table.integer('study_id').notNullable().references('id').inTable('studies');
    table.string('name', 200).notNullable();
    table.text('description');
    table.text('labels_json').notNullable();
    table.text('hypothesis_json').notNullable();
    table.double('alpha').notNullable();
    table.string('feed_kind', 8).notNullable();
    table.integer('connection_id').references('id').inTable('source_connections');
    table.text('pull_query');
    table.string('schedule', 120);
    table.string('timezone', 64);
    table.string('webhook_url', 2000);
    table.text('webhook_secret_encrypted');
    table.string('state', 8).notNullable();
    table.boolean('alarm').notNullable().defaultTo(false);
    table.string('alert_state', 16).notNullable().defaultTo('none');
    table.integer('batch_count').notNullable().defaultTo(0);
    table.bigInteger('n').notNullable().defaultTo(0);
    table.double('sequential_p').notNullable().defaultTo(1);
    table.text('sequential_state_json').notNullable();
    table.text('shares_json').notNullable();
    table.timestamp('last_batch_at', { useTz: true });
    table.timestamp('last_period_end', { useTz: true });
    table.text('last_error');
    table.timestamp('last_error_at', { useTz: true });
    table.integer('created_by').notNullable().references('id').inTable('users');
    table.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.timestamp('deleted_at', { useTz: true });
    table.index(['study_id']);
    table.index(['feed_kind', 'state']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('watches');
}
