import type { Knex } from 'knex';

// A password-reset link: only the SHA-256 of the token is kept; single use (used_at), 1 h (expires_at).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('password_resets', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.increments('id').primary();
    table.integer('user_id').unsigned().notNullable().references('id').inTable('users').onDelete('CASCADE');
    table.string('token_hash', 64).notNullable().unique('password_resets_token_hash_unique');
    table.datetime('created_at', { precision: 3 }).notNullable();
    table.datetime('expires_at', { precision: 3 }).notNullable();
    table.datetime('used_at', { precision: 3 }).nullable();
    table.index(['user_id'], 'password_resets_user_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('password_resets');
}
