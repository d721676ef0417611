import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('coach_athletes', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.integer('coach_user_id').unsigned().notNullable().references('id').inTable('users').onDelete('RESTRICT');
    table.integer('athlete_id').unsigned().notNullable().references('id').inTable('athletes').onDelete('CASCADE');
    table.primary(['coach_user_id', 'athlete_id']);
    table.datetime('created_at').notNullable().defaultTo(knex.fn.now());
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('coach_athletes');
}
