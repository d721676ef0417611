import type { Knex } from 'knex';

export const LIVE_STATUSES = ['active', 'ended'] as const;

// A live lesson: the bridge streams the recording in chunks while the student is on the mat. token_hash is the
// SHA-256 of the bearer token for ingest into this live session only (the token itself is never stored);
// preamble is the stream's metadata lines and header row (from chunk 0). Ending makes a normal recording
// (recording_id).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('live_sessions', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.increments('id').primary();
    table.integer('athlete_id').unsigned().notNullable().references('id').inTable('athletes').onDelete('CASCADE');
    table.integer('session_id').unsigned().notNullable().references('id').inTable('practice_sessions').onDelete('CASCADE');
    table.integer('coach_user_id').unsigned().nullable().references('id').inTable('users').onDelete('SET NULL');
    table.specificType('token_hash', 'char(64)').notNullable();
    table.enu('status', LIVE_STATUSES).notNullable().defaultTo('active');
    table.text('preamble').nullable();
    table.integer('preamble_lines').unsigned().nullable();
    table.string('drill_focus', 200).nullable();
    table.datetime('last_chunk_at', { precision: 3 }).nullable();
    table.string('end_reason', 20).nullable();
    table.datetime('ended_at', { precision: 3 }).nullable();
    table.integer('recording_id').unsigned().nullable().references('id').inTable('recordings').onDelete('SET NULL');
    table.datetime('reconciled_at', { precision: 3 }).nullable();
    table.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    table.unique(['token_hash'], { indexName: 'live_sessions_token_unique' });
    table.index(['status', 'last_chunk_at'], 'live_sessions_status_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('live_sessions');
}
