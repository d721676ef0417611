import type { Knex } from 'knex';

// The bin for drills: DELETE /api/drills/:id sets binned_at (with the drill's assignments hidden), restore clears it; the sweep removes it after 30 days.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('drills', (table) => {
    table.datetime('binned_at', { precision: 3 }).nullable();
    table.index(['binned_at'], 'drills_binned_at_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('drills', (table) => {
    table.dropIndex(['binned_at'], 'drills_binned_at_index');
    table.dropColumn('binned_at');
  });
}
