import type { Knex } from 'knex';

// A removed note waits in the bin (swing_annotations.binned_at) instead of being deleted: its undo brings back the
// same note, id and all, and the bin's sweep removes it after BIN_DAYS (lib/sessions/bin.ts).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('swing_annotations', (table) => {
    table.datetime('binned_at', { precision: 3 }).nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('swing_annotations', (table) => {
    table.dropColumn('binned_at');
  });
}
