import type { Knex } from 'knex';

/** Personal API tokens for pipelines and refresh tokens for signed-in sessions; both stored as hashes only. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('api_tokens', (table) => {
    table.increments('id').primary();
    table.integer('user_id').notNullable().references('id').inTable('users');
    table.string('name', 100).notNullable();
    table.string('token_hash', 64).notNullable().unique();
    // The first characters of the token, so a person can tell their tokens apart.
    table.string('hint', 16).notNullable();
    table.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.timestamp('last_used_at', { useTz: true });
    table.timestamp('revoked_at', { useTz: true });
    table.index(['user_id']);
  });
  await knex.schema.createTable('refresh_tokens', (table) => {
    table.increments('id').primary();
    table.integer('user_id').notNullable().references('id').inTable('users');
    table.string('token_hash', 64).notNullable().unique();
    table.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.timestamp('expires_at', { useTz: true }).notNullable();
    table.timestamp('revoked_at', { useTz: true });
    table.integer('replaced_by');
    table.index(['user_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('refresh_tokens');
  await knex.schema.dropTable('api_tokens');
}
