import type { Knex } from 'knex';

// A coach's "count this as a swing" on a rejected candidate: kept for every later analysis of the recording (the
// reprocess runs the promotion again) and the audit of who asked when. Deleting the row withdraws the promotion.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('candidate_promotions', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.increments('id').primary();
    table.integer('recording_id').unsigned().notNullable().references('id').inTable('recordings').onDelete('CASCADE');
    table.double('time_s').notNullable();
    table.string('reason', 40).notNullable();
    table.integer('user_id').unsigned().nullable().references('id').inTable('users').onDelete('SET NULL');
    table.datetime('at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    table.index(['recording_id'], 'candidate_promotions_recording_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('candidate_promotions');
}
