import type { Knex } from 'knex';

// The bin for reference bands: DELETE /api/bands/:id sets binned_at, restore clears it; the sweep removes it after 30 days.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('bands', (table) => {
    table.datetime('binned_at', { precision: 3 }).nullable();
    table.index(['binned_at'], 'bands_binned_at_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('bands', (table) => {
    table.dropIndex(['binned_at'], 'bands_binned_at_index');
    table.dropColumn('binned_at');
  });
}
