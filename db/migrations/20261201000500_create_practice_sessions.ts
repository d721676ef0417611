import type { Knex } from 'knex';

export const SESSION_CONTEXTS = ['lesson', 'practice', 'on-course'] as const;

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('practice_sessions', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.increments('id').primary();
    table.integer('athlete_id').unsigned().notNullable().references('id').inTable('athletes').onDelete('CASCADE');
    // The coach who ran it (null for solo practice, or once that coach's account is removed).
    table.integer('coach_user_id').unsigned().nullable().references('id').inTable('users').onDelete('SET NULL');
    table.date('session_date').notNullable();
    table.enu('context', SESSION_CONTEXTS).notNullable();
    table.string('location', 120).nullable();
    table.text('notes').nullable();
    table.datetime('created_at').notNullable().defaultTo(knex.fn.now());
    table.datetime('updated_at').notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP ON UPDATE CURRENT_TIMESTAMP'));
    table.index(['athlete_id', 'session_date'], 'practice_sessions_athlete_date_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('practice_sessions');
}
