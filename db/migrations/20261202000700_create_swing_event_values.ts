import type { Knex } from 'knex';

const EVENT_NAMES = ['address', 'top', 'transition', 'impact', 'finish'] as const;

// Values at each event of a swing (lib/signal/phases.ts atEvents): lead %, heel % per foot, stance COP.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('swing_event_values', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.increments('id').primary();
    table.integer('swing_id').unsigned().notNullable().references('id').inTable('swings').onDelete('CASCADE');
    table.enu('event', EVENT_NAMES).notNullable();
    table.double('lead_pct').nullable();
    table.double('lead_heel_pct').nullable();
    table.double('trail_heel_pct').nullable();
    table.double('cop_x_mm').nullable();
    table.double('cop_y_mm').nullable();
    table.unique(['swing_id', 'event'], { indexName: 'swing_event_values_swing_event_unique' });
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('swing_event_values');
}
