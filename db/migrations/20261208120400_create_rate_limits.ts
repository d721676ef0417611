import type { Knex } from 'knex';

// Counters of rate-limiter-flexible's MySQL store (password-reset requests). The columns are the ones the library's
// own CREATE TABLE uses; the app passes tableCreated: true so the library never creates tables itself.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('rate_limits', (table) => {
    table.string('key', 255).notNullable().primary();
    table.integer('points').notNullable().defaultTo(0);
    table.bigInteger('expire').unsigned().nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('rate_limits');
}
