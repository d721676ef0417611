import type { Knex } from 'knex';

// Each swing found live: its events (s on the stream's time axis from its first sample), values, score and small
// trace, and the coach's one-tap labels (club, strike, not a swing). When the live session ends and the final
// analysis is ready, swing_id points at the final swing that matched it and the labels are copied there.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('live_swings', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.increments('id').primary();
    table.integer('live_session_id').unsigned().notNullable().references('id').inTable('live_sessions').onDelete('CASCADE');
    table.smallint('number').unsigned().notNullable();
    table.double('impact_s').notNullable();
    table.json('result').notNullable();
    table.string('club', 20).nullable();
    table.string('strike', 20).nullable();
    table.boolean('not_swing').notNullable().defaultTo(false);
    table.integer('swing_id').unsigned().nullable().references('id').inTable('swings').onDelete('SET NULL');
    table.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    table.unique(['live_session_id', 'number'], { indexName: 'live_swings_number_unique' });
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('live_swings');
}
