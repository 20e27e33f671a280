import type { Knex } from 'knex';

/** Studies group analyses; members hold a role inside the study (owner, contributor or reader). */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('studies', (table) => {
    table.increments('id').primary();
    table.string('name', 200).notNullable();
    table.text('description');
    table.integer('created_by').notNullable().references('id').inTable('users');
    table.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.timestamp('archived_at', { useTz: true });
    table.index(['name']);
  });
  await knex.schema.createTable('study_members', (table) => {
    table.integer('study_id').notNullable().references('id').inTable('studies').onDelete('CASCADE');
    table.integer('user_id').notNullable().references('id').inTable('users');
    table.string('study_role', 16).notNullable();
    table.timestamp('added_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    table.primary(['study_id', 'user_id']);
    // "Which studies does this person belong to?" is asked on every read.
    table.index(['user_id', 'study_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('study_members');
  await knex.schema.dropTable('studies');
}
