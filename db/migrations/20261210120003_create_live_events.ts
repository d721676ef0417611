import type { Knex } from 'knex';

// What the coach's screen is told, in order: swings, gaps and status changes. The id is the SSE event id, so a
// reconnecting client's Last-Event-ID is a cursor into this table; every instance's event stream reads it.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('live_events', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.bigIncrements('id').primary();
    table.integer('live_session_id').unsigned().notNullable().references('id').inTable('live_sessions').onDelete('CASCADE');
    table.enu('kind', ['swing', 'gap', 'status']).notNullable();
    table.json('payload').notNullable();
    table.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    table.index(['live_session_id', 'id'], 'live_events_session_cursor_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('live_events');
}
