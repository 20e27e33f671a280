import type { Knex } from 'knex';

/** The audit trail: who did what to which record, when, with a short before/after summary. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('audit_events', (table) => {
    table.increments('id').primary();
    table.timestamp('at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    // Null for events without a signed-in person (a failed sign-in with an unknown e-mail).
    table.integer('actor_id').references('id').inTable('users');
    table.string('action', 32).notNullable();
    table.string('entity_type', 32).notNullable();
    table.string('entity_id', 64);
    table.integer('study_id');
    table.string('summary', 500).notNullable();
    table.text('before_json');
    table.text('after_json');
    table.index(['at']);
    table.index(['entity_type', 'entity_id']);
    table.index(['actor_id', 'at']);
    table.index(['study_id', 'at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('audit_events');
}
