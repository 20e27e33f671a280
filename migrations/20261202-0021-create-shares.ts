import type { Knex } from 'knex';

/** E-mail shares of analyses: to whom, by whom, and whether the mail server took the message. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('shares', (table) => {
    table.increments('id').primary();
    table.integer('analysis_id').notNullable().references('id').inTable('analyses');
    table.integer('sent_by').notNullable().references('id').inTable('users');
    table.text('recipients_json').notNullable();
    table.text('message');
    table.string('status', 8).notNullable();
    table.string('failure_reason', 500);
    table.string('message_id', 255);
    table.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.index(['analysis_id', 'created_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('shares');
}
