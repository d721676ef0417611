import type { Knex } from 'knex';

// Target patterns: expected values with tolerances at events (checks, JSON array) per club group, academy-wide
// defaults (owner null, is_default) or a coach's own, optionally for one athlete. common_practice marks the seeded
// defaults, which are coaching lore rather than published norms.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('targets', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.increments('id').primary();
    table.integer('academy_id').unsigned().notNullable().references('id').inTable('academies').onDelete('CASCADE');
    table.integer('owner_user_id').unsigned().nullable().references('id').inTable('users').onDelete('CASCADE');
    table.integer('athlete_id').unsigned().nullable().references('id').inTable('athletes').onDelete('CASCADE');
    table.string('name', 120).notNullable();
    table.text('description').notNullable();
    table.enu('club_group', ['driver', 'woods-hybrids', 'irons', 'wedges']).notNullable();
    table.boolean('is_default').notNullable().defaultTo(false);
    table.boolean('common_practice').notNullable().defaultTo(false);
    table.text('checks').notNullable();
    table.double('tempo_min').nullable();
    table.double('tempo_max').nullable();
    table.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    table.datetime('updated_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    table.index(['academy_id', 'club_group'], 'targets_academy_group_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('targets');
}
