import type { Knex } from 'knex';

// An invitation by e-mail: only the SHA-256 of the random token is kept (the token itself lives in the mail alone).
// Single use (accepted_at), 72 h (expires_at), revocable (revoked_at). athlete_id links a student's new account.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('invitations', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.increments('id').primary();
    table.integer('academy_id').unsigned().notNullable().references('id').inTable('academies').onDelete('CASCADE');
    table.string('email', 254).notNullable();
    table.enum('role', ['admin', 'coach', 'student', 'researcher']).notNullable();
    table.integer('athlete_id').unsigned().nullable().references('id').inTable('athletes').onDelete('CASCADE');
    table.integer('invited_by').unsigned().nullable().references('id').inTable('users').onDelete('SET NULL');
    table.string('token_hash', 64).notNullable().unique('invitations_token_hash_unique');
    table.datetime('created_at', { precision: 3 }).notNullable();
    table.datetime('sent_at', { precision: 3 }).notNullable();
    table.datetime('expires_at', { precision: 3 }).notNullable();
    table.datetime('accepted_at', { precision: 3 }).nullable();
    table.integer('accepted_user_id').unsigned().nullable().references('id').inTable('users').onDelete('SET NULL');
    table.datetime('revoked_at', { precision: 3 }).nullable();
    table.index(['academy_id', 'email'], 'invitations_academy_email_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('invitations');
}
