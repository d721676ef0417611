import type { Knex } from 'knex';

// Which app instance holds a live session's buffer. The owner renews expires_at while it works; when it dies the
// lease runs out and the next instance that sees the session (a chunk, an event stream, the sweep) takes it over
// and rebuilds the buffer from live_chunks. level is the latest weight split (about 10 times a second), written by the
// owner only, read by every instance's event streams.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('live_leases', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.integer('live_session_id').unsigned().primary().references('id').inTable('live_sessions').onDelete('CASCADE');
    table.string('owner', 120).notNullable();
    table.datetime('expires_at', { precision: 3 }).notNullable();
    table.json('level').nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('live_leases');
}
