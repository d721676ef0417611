import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('athletes', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.increments('id').primary();
    table.integer('academy_id').unsigned().notNullable().references('id').inTable('academies').onDelete('RESTRICT');
    // The student's own login, if any; one account is at most one athlete.
    table
      .integer('user_id')
      .unsigned()
      .nullable()
      .unique({ indexName: 'athletes_user_id_unique' })
      .references('id')
      .inTable('users')
      .onDelete('SET NULL');
    table.string('display_name', 120).notNullable();
    table.enu('handedness', ['right', 'left']).notNullable().defaultTo('right');
    // Heel-to-heel stance width; the same 150..900 mm range is enforced by the zod schema of the form.
    table.smallint('stance_width_mm').unsigned().notNullable().defaultTo(400);
    table.date('date_of_birth').nullable();
    table.string('home_club', 120).nullable();
    table.datetime('created_at').notNullable().defaultTo(knex.fn.now());
    table.datetime('updated_at').notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP ON UPDATE CURRENT_TIMESTAMP'));
    table.check('?? BETWEEN 150 AND 900', ['stance_width_mm'], 'athletes_stance_width_range');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('athletes');
}
