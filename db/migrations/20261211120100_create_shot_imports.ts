import type { Knex } from 'knex';

// One uploaded shot log of a session. The raw bytes are kept in storage (storage_key) before any parsing, also when
// the file is refused (status 'failed', error_message). offset_s is the clock offset in use (shot clock minus insole
// clock, seconds), auto_offset_s what the interval alignment found. binned_at: deleted by the coach (the bin).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('shot_imports', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.increments('id').primary();
    table.integer('session_id').unsigned().notNullable().references('id').inTable('practice_sessions').onDelete('CASCADE');
    table.integer('uploaded_by').unsigned().nullable().references('id').inTable('users').onDelete('SET NULL');
    table.string('filename', 255).notNullable();
    table.bigInteger('byte_size').unsigned().notNullable();
    table.specificType('sha256', 'char(64)').notNullable();
    table.string('storage_key', 255).notNullable();
    table.json('profile').notNullable();
    table.enu('status', ['ready', 'failed']).notNullable();
    table.text('error_message').nullable();
    table.double('offset_s').nullable();
    table.double('auto_offset_s').nullable();
    table.double('tolerance_s').notNullable();
    table.datetime('binned_at').nullable();
    table.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    table.index(['session_id', 'created_at'], 'shot_imports_session_created_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('shot_imports');
}
