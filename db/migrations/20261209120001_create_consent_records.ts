import type { Knex } from 'knex';

// Research consent, one row per decision (append-only): the current consent of a player is their newest row; older
// rows are the history. `research` false is a revocation. `guardian_consent` records a parent's or guardian's consent,
// needed for the sessions a player had before reaching the adult age (lib/research/age.ts). Who recorded it, in which
// role and when are kept with it.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('consent_records', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.increments('id').primary();
    table.integer('athlete_id').unsigned().notNullable().references('id').inTable('athletes').onDelete('CASCADE');
    table.enu('scope', ['research']).notNullable().defaultTo('research');
    table.boolean('research').notNullable();
    table.boolean('guardian_consent').notNullable().defaultTo(false);
    table.integer('recorded_by').unsigned().nullable().references('id').inTable('users').onDelete('SET NULL');
    table.enu('recorded_by_role', ['admin', 'coach', 'student']).notNullable();
    table.datetime('recorded_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    table.index(['athlete_id', 'id'], 'consent_records_athlete_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('consent_records');
}
