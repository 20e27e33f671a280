import type { Knex } from 'knex';

/**
 * Notifications of review decisions: one row per recipient, written with the decision; the e-mail
 * copy's outcome is recorded on the row after the decision committed.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('notifications', (table) => {
    table.increments('id').primary();
    table.integer('recipient_id').notNullable().references('id').inTable('users');
    table.integer('analysis_id').notNullable().references('id').inTable('analyses');
    table.integer('actor_id').notNullable().references('id').inTable('users');
    table.string('kind', 16).notNullable();
    table.text('note');
    table.timestamp('read_at', { useTz: true });
    table.string('mail_status', 8).notNullable().defaultTo('pending');
    table.string('mail_failure', 500);
    table.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.index(['recipient_id', 'created_at']);
    table.index(['recipient_id', 'read_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('notifications');
}
