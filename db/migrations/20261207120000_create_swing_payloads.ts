import type { Knex } from 'knex';

// The viewer's heavy, reader-independent part of GET /api/swings/:id (columnar traces, the recording overview, the
// sensor layout, per-sensor forces at the events), built as JSON text when the recording is processed and again
// after each event correction (lib/swings/payload-build.ts), so a request sends it without rebuilding it.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('swing_payloads', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.integer('swing_id').unsigned().primary().references('id').inTable('swings').onDelete('CASCADE');
    table.specificType('body', 'mediumtext').notNullable();
    table.datetime('built_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('swing_payloads');
}
