import type { Knex } from 'knex';

// The bin for drill assignments: DELETE /api/drill-assignments/:id sets binned_at, restore clears it; the sweep removes it after 30 days.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('drill_assignments', (table) => {
    table.datetime('binned_at', { precision: 3 }).nullable();
    table.index(['binned_at'], 'drill_assignments_binned_at_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('drill_assignments', (table) => {
    table.dropIndex(['binned_at'], 'drill_assignments_binned_at_index');
    table.dropColumn('binned_at');
  });
}
