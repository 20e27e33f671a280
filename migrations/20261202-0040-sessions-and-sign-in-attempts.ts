import type { Knex } from 'knex';

/**
 * Sessions and sign-in limits that hold across servers sharing one database:
 * - users.sessions_valid_after_ms: access tokens issued before this moment (ms since 1970, the
 *   server's clock) are refused; set on sign-out and password change.
 * - sign_in_attempts: one row per sign-in attempt until it succeeds (then removed), counted per
 *   e-mail and per address over a sliding window.
 */
/**
 * Outside a transaction: SQLite drops a column by rebuilding the table, which needs foreign-key
 * checks switched off for the rebuild, and SQLite ignores that switch inside a transaction.
 */
export const config = { transaction: false };

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('users', (table) => {
    table.bigInteger('sessions_valid_after_ms');
  });
  await knex.schema.createTable('sign_in_attempts', (table) => {
    table.increments('id').primary();
    table.string('email', 320).notNullable();
    table.string('address', 64).notNullable();
    table.bigInteger('attempted_at_ms').notNullable();
    table.index(['email', 'attempted_at_ms']);
    table.index(['address', 'attempted_at_ms']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('sign_in_attempts');
  await knex.schema.alterTable('users', (table) => {
    table.dropColumn('sessions_valid_after_ms');
  });
}
