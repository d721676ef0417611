import type { Knex } from 'knex';

// The display series of a recording: each derived trace reduced to per-bucket min/max (a few thousand points),
// as JSON. One row per recording, replaced with the rest of the results.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('recording_series', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.integer('recording_id').unsigned().primary().references('id').inTable('recordings').onDelete('CASCADE');
    table.string('method', 20).notNullable();
    table.integer('buckets').unsigned().notNullable();
    table.double('bucket_s').notNullable();
    table.specificType('data', 'longtext').notNullable();
    table.datetime('created_at').notNullable().defaultTo(knex.fn.now());
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('recording_series');
}
