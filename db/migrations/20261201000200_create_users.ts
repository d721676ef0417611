import type { Knex } from 'knex';

export const USER_ROLES = ['admin', 'coach', 'student', 'researcher'] as const;

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('users', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.increments('id').primary();
    table.integer('academy_id').unsigned().notNullable().references('id').inTable('academies').onDelete('RESTRICT');
    table.string('email', 254).notNullable().unique({ indexName: 'users_email_unique' });
    table.string('name', 120).notNullable();
    table.string('password_hash', 255).notNullable();
    table.enu('role', USER_ROLES).notNullable();
    table.boolean('active').notNullable().defaultTo(true);
    table.datetime('created_at').notNullable().defaultTo(knex.fn.now());
    table.datetime('updated_at').notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP ON UPDATE CURRENT_TIMESTAMP'));
    // The column collation is case-insensitive, so compare bytes: the app must store e-mails lower-cased.
    table.check('CAST(?? AS BINARY) = CAST(LOWER(??) AS BINARY)', ['email', 'email'], 'users_email_lowercase');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('users');
}
