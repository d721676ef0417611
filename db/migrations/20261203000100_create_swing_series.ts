import type { Knex } from 'knex';

// The full-rate derived series over one swing's window [start_s, end_s] and the per-sensor filtered forces over
// the same samples, as JSON (NaN as null), written with the rest of the results. Moved events are re-valued from
// it without re-reading the raw file; the viewer draws the swing and the foot view from it.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('swing_series', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.integer('swing_id').unsigned().primary().references('id').inTable('swings').onDelete('CASCADE');
    table.double('sample_rate_hz').notNullable();
    table.integer('samples').unsigned().notNullable();
    table.specificType('data', 'longtext').notNullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('swing_series');
}
