import type { Knex } from 'knex';

export const RECORDING_STATUSES = ['received', 'processing', 'ready', 'failed'] as const;

// One uploaded insole file. The raw bytes live in storage under storage_key (kept before any parsing); `options`
// is what the uploader asked for (layout, profile, handedness, stance width, cutoff), `parameters` the processing
// parameters the last successful analysis actually used. The same bytes (sha256) appear at most once per session.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('recordings', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.increments('id').primary();
    table.integer('athlete_id').unsigned().notNullable().references('id').inTable('athletes').onDelete('CASCADE');
    table.integer('session_id').unsigned().notNullable().references('id').inTable('practice_sessions').onDelete('CASCADE');
    table.integer('uploaded_by').unsigned().nullable().references('id').inTable('users').onDelete('SET NULL');
    table.string('filename', 255).notNullable();
    table.bigInteger('byte_size').unsigned().notNullable();
    table.specificType('sha256', 'char(64)').notNullable();
    table.string('storage_key', 255).notNullable();
    table.enu('status', RECORDING_STATUSES).notNullable().defaultTo('received');
    table.text('error_message').nullable();
    table.integer('error_line').unsigned().nullable();
    table.integer('error_column').unsigned().nullable();
    table.json('options').notNullable();
    table.json('parameters').nullable();
    table.string('algorithm_version', 64).nullable();
    table.json('metadata').nullable();
    table.datetime('processed_at', { precision: 3 }).nullable();
    table.datetime('created_at').notNullable().defaultTo(knex.fn.now());
    table.datetime('updated_at').notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP ON UPDATE CURRENT_TIMESTAMP'));
    table.unique(['session_id', 'sha256'], { indexName: 'recordings_session_sha256_unique' });
    table.index(['athlete_id', 'created_at'], 'recordings_athlete_created_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('recordings');
}
