import type { Knex } from 'knex';

// Shot profiles a coach saved for launch-monitor logs (README "Shot logs"): how a file's columns, delimiter, decimal
// mark and units map onto ours; reusable on every shot import of that coach (the same name replaces the old one).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('shot_profiles', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.increments('id').primary();
    table.integer('coach_user_id').unsigned().notNullable().references('id').inTable('users').onDelete('CASCADE');
    table.string('name', 80).notNullable();
    table.json('profile').notNullable();
    table.datetime('created_at').notNullable().defaultTo(knex.fn.now());
    table.datetime('updated_at').notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP ON UPDATE CURRENT_TIMESTAMP'));
    table.unique(['coach_user_id', 'name'], { indexName: 'shot_profiles_coach_name_unique' });
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('shot_profiles');
}
