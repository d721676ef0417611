import type { Knex } from 'knex';

// A drill given to an athlete with a due date; the student marks practice done and may leave a note.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('drill_assignments', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.increments('id').primary();
    table.integer('drill_id').unsigned().notNullable().references('id').inTable('drills').onDelete('CASCADE');
    table.integer('athlete_id').unsigned().notNullable().references('id').inTable('athletes').onDelete('CASCADE');
    table.integer('assigned_by').unsigned().nullable().references('id').inTable('users').onDelete('SET NULL');
    table.date('assigned_at').notNullable();
    table.date('due_date').notNullable();
    table.boolean('practice_done').notNullable().defaultTo(false);
    table.datetime('done_at', { precision: 3 }).nullable();
    table.text('student_note').nullable();
    table.index(['athlete_id'], 'drill_assignments_athlete_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('drill_assignments');
}
