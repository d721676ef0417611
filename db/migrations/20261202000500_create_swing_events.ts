import type { Knex } from 'knex';

export const EVENT_NAMES = ['address', 'top', 'transition', 'impact', 'finish'] as const;

// The five events of a swing, seconds on the recording's time axis. A manual correction sets source 'manual' and
// keeps the automatic time in auto_time_s; `misfit` flags a manual time that a later reprocess left outside the
// swing or out of event order.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('swing_events', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.increments('id').primary();
    table.integer('swing_id').unsigned().notNullable().references('id').inTable('swings').onDelete('CASCADE');
    table.enu('name', EVENT_NAMES).notNullable();
    table.double('time_s').notNullable();
    table.enu('source', ['auto', 'manual']).notNullable().defaultTo('auto');
    table.double('auto_time_s').nullable();
    table.boolean('misfit').notNullable().defaultTo(false);
    table.unique(['swing_id', 'name'], { indexName: 'swing_events_swing_name_unique' });
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('swing_events');
}
