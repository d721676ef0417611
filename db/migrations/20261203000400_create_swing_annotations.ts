import type { Knex } from 'knex';

const PHASE_NAMES = ['backswing', 'transition', 'downswing', 'follow-through'] as const;

// A note on a swing, pinned to a time (s on the recording's axis) or to a phase, or to neither (the whole swing).
// visibility 'coach' stays with the coaches; 'shared' is shown to the student too.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('swing_annotations', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.increments('id').primary();
    table.integer('swing_id').unsigned().notNullable().references('id').inTable('swings').onDelete('CASCADE');
    table.integer('author_user_id').unsigned().nullable().references('id').inTable('users').onDelete('SET NULL');
    table.text('body').notNullable();
    table.double('time_s').nullable();
    table.enu('phase', PHASE_NAMES).nullable();
    table.enu('visibility', ['coach', 'shared']).notNullable().defaultTo('coach');
    table.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    table.datetime('updated_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    table.index(['swing_id'], 'swing_annotations_swing');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('swing_annotations');
}
