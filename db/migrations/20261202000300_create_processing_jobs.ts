import type { Knex } from 'knex';

export const JOB_STATES = ['queued', 'running', 'done', 'failed'] as const;

// The processing queue. Workers claim a row with SELECT ... FOR UPDATE SKIP LOCKED (MariaDB 10.6+), set it
// running with their id and keep heartbeat_at fresh; a running row whose heartbeat is older than the lock timeout
// belonged to a worker that died and is claimed again (or failed once attempts reach max_attempts).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('processing_jobs', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.bigIncrements('id').primary();
    table.integer('recording_id').unsigned().notNullable().references('id').inTable('recordings').onDelete('CASCADE');
    table.enu('state', JOB_STATES).notNullable().defaultTo('queued');
    table.smallint('attempts').unsigned().notNullable().defaultTo(0);
    table.smallint('max_attempts').unsigned().notNullable().defaultTo(3);
    table.datetime('run_after', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    table.string('locked_by', 120).nullable();
    table.datetime('locked_at', { precision: 3 }).nullable();
    table.datetime('heartbeat_at', { precision: 3 }).nullable();
    table.text('last_error').nullable();
    table.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    table.datetime('finished_at', { precision: 3 }).nullable();
    table.index(['state', 'run_after'], 'processing_jobs_state_run_after_index');
    table.index(['state', 'heartbeat_at'], 'processing_jobs_state_heartbeat_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('processing_jobs');
}
