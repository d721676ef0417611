import type { Knex } from 'knex';

// A coach's drill library: steps (JSON array of strings), the target checks it works on (JSON array of
// { event, measure }) and the cautions shown with it.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('drills', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.increments('id').primary();
    table.integer('academy_id').unsigned().notNullable().references('id').inTable('academies').onDelete('CASCADE');
    table.integer('owner_user_id').unsigned().notNullable().references('id').inTable('users').onDelete('CASCADE');
    table.string('name', 120).notNullable();
    table.text('steps').notNullable();
    table.text('addresses_checks').notNullable();
    table.text('cautions').notNullable();
    table.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    table.datetime('updated_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('drills');
}
