import type { Knex } from 'knex';

// One row per sign-in attempt; the indexes serve "attempts for this e-mail / from this address since T".
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('login_attempts', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.bigIncrements('id').primary();
    table.string('email', 254).notNullable();
    table.string('ip', 45).notNullable(); // 45 = longest textual IPv6 (IPv4-mapped) address
    table.boolean('succeeded').notNullable();
    table.datetime('attempted_at', { precision: 3 }).notNullable();
    table.index(['email', 'attempted_at'], 'login_attempts_email_time_index');
    table.index(['ip', 'attempted_at'], 'login_attempts_ip_time_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('login_attempts');
}
