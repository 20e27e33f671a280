import type { Knex } from 'knex';

/**
 * A team's own databases that pull-fed watches read from. The password is stored encrypted
 * (AES-256-GCM under the server's secret key) and never returned; deleting keeps the row so the
 * audit trail and the watches that used it still name it.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('source_connections', (table) => {
    table.increments('id').primary();
    table.string('name', 200).notNullable();
    table.string('kind', 16).notNullable();
    table.string('host', 255).notNullable();
    table.integer('port').notNullable();
    table.string('database_name', 255).notNullable();
    table.string('user_name', 255).notNullable();
    table.boolean('ssl').notNullable().defaultTo(false);
    table.text('password_encrypted').notNullable();
    table.integer('created_by').notNullable().references('id').inTable('users');
    table.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.timestamp('deleted_at', { useTz: true });
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('source_connections');
}
