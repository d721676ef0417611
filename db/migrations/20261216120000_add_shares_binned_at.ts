import type { Knex } from 'knex';

// The bin for shares: DELETE /api/shares/:id sets binned_at (the student's list leaves it out), restore clears it;
// the sweep removes it after 30 days.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('shares', (table) => {
    table.datetime('binned_at', { precision: 3 }).nullable();
    table.index(['binned_at'], 'shares_binned_at_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('shares', (table) => {
    table.dropIndex(['binned_at'], 'shares_binned_at_index');
    table.dropColumn('binned_at');
  });
}
