import type { Knex } from 'knex';

// The units a user reads shot values in (stored values are SI either way): metric (km/h, m) or imperial (mph, yd).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('users', (table) => {
    table.enu('shot_units', ['metric', 'imperial']).notNullable().defaultTo('metric');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('users', (table) => {
    table.dropColumn('shot_units');
  });
}
