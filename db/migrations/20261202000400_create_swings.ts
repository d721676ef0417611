import type { Knex } from 'knex';

// One swing found in a recording (index 1..n in time order). `hidden` lets a coach set a swing aside later;
// `stale` marks a swing kept only because it carries manual corrections that a reprocess no longer found.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('swings', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.increments('id').primary();
    table.integer('recording_id').unsigned().notNullable().references('id').inTable('recordings').onDelete('CASCADE');
    table.smallint('swing_index').unsigned().notNullable();
    table.double('start_s').notNullable();
    table.double('end_s').notNullable();
    table.enu('impact_source', ['marker', 'detected']).notNullable();
    table.double('tempo_ratio').nullable();
    table.boolean('hidden').notNullable().defaultTo(false);
    table.boolean('stale').notNullable().defaultTo(false);
    table.datetime('created_at').notNullable().defaultTo(knex.fn.now());
    table.unique(['recording_id', 'swing_index'], { indexName: 'swings_recording_index_unique' });
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('swings');
}
