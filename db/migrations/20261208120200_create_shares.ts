import type { Knex } from 'knex';

// What a coach sent a student by e-mail: a lesson summary (session_id) or one swing (swing_id), never both.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('shares', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.increments('id').primary();
    table.integer('athlete_id').unsigned().notNullable().references('id').inTable('athletes').onDelete('CASCADE');
    table.integer('session_id').unsigned().nullable().references('id').inTable('practice_sessions').onDelete('CASCADE');
    table.integer('swing_id').unsigned().nullable().references('id').inTable('swings').onDelete('CASCADE');
    table.integer('shared_by').unsigned().nullable().references('id').inTable('users').onDelete('SET NULL');
    table.integer('recipient_user_id').unsigned().notNullable().references('id').inTable('users').onDelete('CASCADE');
    table.string('note', 500).nullable();
    table.datetime('created_at', { precision: 3 }).notNullable();
    table.index(['recipient_user_id', 'created_at'], 'shares_recipient_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('shares');
}
