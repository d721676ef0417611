import type { Knex } from 'knex';

// A recording's videos: the original as uploaded (original_key, kept always), the browser-playable mp4 and its
// poster once processed, what ffprobe read, and the sync: video time = recording time + offset_s, found from the
// sound of impact ('audio') or set by the coach ('manual'). The row is its own processing job (status, attempts,
// locked_by, heartbeat_at), claimed with SELECT ... FOR UPDATE SKIP LOCKED by the app's worker.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('videos', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.increments('id').primary();
    table.integer('recording_id').unsigned().notNullable().references('id').inTable('recordings').onDelete('CASCADE');
    table.integer('uploaded_by').unsigned().nullable().references('id').inTable('users').onDelete('SET NULL');
    table.string('filename', 255).notNullable();
    table.bigInteger('byte_size').unsigned().notNullable();
    table.string('original_key', 255).notNullable();
    table.string('playable_key', 255).nullable();
    table.string('poster_key', 255).nullable();
    table.bigInteger('playable_bytes').unsigned().nullable();
    table.enu('status', ['queued', 'processing', 'ready', 'failed']).notNullable().defaultTo('queued');
    table.string('error', 500).nullable();
    table.integer('attempts').unsigned().notNullable().defaultTo(0);
    table.string('locked_by', 120).nullable();
    table.datetime('heartbeat_at', { precision: 3 }).nullable();
    table.double('fps').nullable();
    table.double('duration_s').nullable();
    table.smallint('rotation').nullable();
    table.integer('width').unsigned().nullable();
    table.integer('height').unsigned().nullable();
    table.double('offset_s').nullable();
    table.enu('sync_source', ['audio', 'manual']).nullable();
    table.string('sync_note', 300).nullable();
    // the bin: a video a coach deleted waits BIN_DAYS days before the sweep removes it and its files
    table.datetime('binned_at', { precision: 3 }).nullable();
    table.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    table.index(['recording_id'], 'videos_recording_index');
    table.index(['status'], 'videos_status_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('videos');
}
