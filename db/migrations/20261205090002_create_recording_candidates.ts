import type { Knex } from 'knex';

// The candidates the last analysis of a recording rejected, with the reason: the coach sees them on the overview
// and may promote one. Replaced on every analysis.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('recording_candidates', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.increments('id').primary();
    table.integer('recording_id').unsigned().notNullable().references('id').inTable('recordings').onDelete('CASCADE');
    table.double('time_s').notNullable();
    table.string('reason', 40).notNullable();
    table.index(['recording_id', 'time_s'], 'recording_candidates_recording_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('recording_candidates');
}
