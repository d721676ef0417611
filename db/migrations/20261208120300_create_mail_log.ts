import type { Knex } from 'knex';

// Notification mails sent, one row per user, kind and UTC day: the unique key makes "at most one a day" hold even when
// two processes try at once (the second insert fails and sends nothing).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('mail_log', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.increments('id').primary();
    table.integer('user_id').unsigned().notNullable().references('id').inTable('users').onDelete('CASCADE');
    table.string('kind', 40).notNullable();
    table.date('day').notNullable();
    table.datetime('created_at', { precision: 3 }).notNullable();
    table.unique(['user_id', 'kind', 'day'], { indexName: 'mail_log_user_kind_day_unique' });
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('mail_log');
}
