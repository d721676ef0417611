import type { Knex } from 'knex';

// The stream as received, chunk by chunk (X-Chunk-Seq), stored before the 202: an acknowledged sample is never lost.
// body holds the chunk's data rows as sent (chunk 0 without its preamble); line_count counts its lines so an error's
// line can be given from the start of the stream. A repeated sequence number is ignored (primary key).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('live_chunks', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.integer('live_session_id').unsigned().notNullable().references('id').inTable('live_sessions').onDelete('CASCADE');
    table.integer('seq').unsigned().notNullable();
    table.specificType('body', 'mediumtext').notNullable();
    table.integer('line_count').unsigned().notNullable();
    table.double('first_time_s').nullable();
    table.double('last_time_s').nullable();
    table.datetime('received_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    table.primary(['live_session_id', 'seq']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('live_chunks');
}
