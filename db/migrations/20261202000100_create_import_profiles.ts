import type { Knex } from 'knex';

// Import profiles a coach saved for files that are not in recording format 1 (README "Import profile"); reusable
// on every upload of that coach. `profile` holds the validated profile JSON.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('import_profiles', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.increments('id').primary();
    table.integer('coach_user_id').unsigned().notNullable().references('id').inTable('users').onDelete('CASCADE');
    table.string('name', 80).notNullable();
    table.json('profile').notNullable();
    table.datetime('created_at').notNullable().defaultTo(knex.fn.now());
    table.datetime('updated_at').notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP ON UPDATE CURRENT_TIMESTAMP'));
    table.unique(['coach_user_id', 'name'], { indexName: 'import_profiles_coach_name_unique' });
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('import_profiles');
}
