import type { Knex } from 'knex';

// Reference bands: mean +- k SD of registered curves from chosen swings. Provenance is kept with the band: the swing
// ids, the parameters used (registration landmarks, points, traces), k and the date. `data` holds the curves (JSON).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('bands', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.increments('id').primary();
    table.integer('academy_id').unsigned().notNullable().references('id').inTable('academies').onDelete('CASCADE');
    table.integer('owner_user_id').unsigned().notNullable().references('id').inTable('users').onDelete('CASCADE');
    table.string('name', 120).notNullable();
    table.text('swing_ids').notNullable();
    table.text('parameters').notNullable();
    table.double('k').notNullable();
    table.boolean('shared').notNullable().defaultTo(false);
    table.specificType('data', 'longtext').notNullable();
    table.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    table.index(['academy_id', 'shared'], 'bands_academy_shared_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('bands');
}
