import type { Knex } from 'knex';

// One row per export: who (user, and the token when one was used), when, which filter, how many players, swings and
// rows. `rows` and `completed_at` are filled in when the stream ends; a stream cut short stays 'started'.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('export_audit', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.increments('id').primary();
    table.integer('academy_id').unsigned().notNullable().references('id').inTable('academies').onDelete('CASCADE');
    table.integer('user_id').unsigned().nullable().references('id').inTable('users').onDelete('SET NULL');
    table.enu('role', ['admin', 'coach', 'student', 'researcher']).notNullable();
    table.integer('token_id').unsigned().nullable().references('id').inTable('api_tokens').onDelete('SET NULL');
    table.string('export', 40).notNullable();
    table.enu('format', ['csv', 'json']).notNullable();
    table.enu('shape', ['long', 'wide']).notNullable();
    table.boolean('identified').notNullable().defaultTo(false);
    table.json('filters').notNullable();
    table.integer('players').unsigned().notNullable();
    table.integer('swings').unsigned().notNullable();
    table.integer('rows').unsigned().nullable();
    table.enu('status', ['started', 'completed', 'failed']).notNullable().defaultTo('started');
    table.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    table.datetime('completed_at', { precision: 3 }).nullable();
    table.index(['academy_id', 'created_at'], 'export_audit_academy_created_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('export_audit');
}
