import type { Knex } from 'knex';

const EVENT_NAMES = ['address', 'top', 'transition', 'impact', 'finish'] as const;

// The audit of event corrections: who moved which event of which swing from where to where, and when; a reset
// back to the automatic time is a row of kind 'reset'. Rows are only ever added.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('swing_event_corrections', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.increments('id').primary();
    table.integer('swing_id').unsigned().notNullable().references('id').inTable('swings').onDelete('CASCADE');
    table.enu('event', EVENT_NAMES).notNullable();
    table.double('from_s').notNullable();
    table.double('to_s').notNullable();
    table.enu('kind', ['move', 'reset']).notNullable();
    table.integer('user_id').unsigned().nullable().references('id').inTable('users').onDelete('SET NULL');
    table.datetime('at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    table.index(['swing_id', 'at'], 'swing_event_corrections_swing_at');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('swing_event_corrections');
}
