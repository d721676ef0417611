import type { Knex } from 'knex';

// What every swing of a recording shares, kept once per recording instead of inside each swing's payload: `body`, the
// part of GET /api/swings/:id (sensor layout, handedness, stance width), and `overview`, GET
// /api/recordings/:id/overview (the whole recording, min/max per bucket, with the passed-over candidates).
// swing_payloads keeps only the swing's own part (its traces and the sensor forces at its events).
// lib/swings/payload-build.ts builds both; the rows already stored in the old combined form are dropped and rebuilt
// on their next read.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('recording_payloads', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.integer('recording_id').unsigned().primary().references('id').inTable('recordings').onDelete('CASCADE');
    table.specificType('body', 'mediumtext').notNullable();
    table.specificType('overview', 'mediumtext').notNullable();
    table.datetime('built_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
  });
  await knex('swing_payloads').delete();
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('recording_payloads');
  await knex('swing_payloads').delete();
}
