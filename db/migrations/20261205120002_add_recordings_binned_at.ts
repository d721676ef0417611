import type { Knex } from 'knex';

// The bin for single recordings: DELETE /api/recordings/:id sets binned_at; the recording and its swings are then
// unknown to every read (404) and left out of every list. POST /api/recordings/:id/restore brings it back within 30
// days; after that the sweep removes the row and its raw file (lib/sessions/bin.ts).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('recordings', (table) => {
    table.datetime('binned_at', { precision: 3 }).nullable();
    table.index(['binned_at'], 'recordings_binned_at_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('recordings', (table) => {
    table.dropIndex(['binned_at'], 'recordings_binned_at_index');
    table.dropColumn('binned_at');
  });
}
