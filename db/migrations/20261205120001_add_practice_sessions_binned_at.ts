import type { Knex } from 'knex';

// The bin for sessions: DELETE /api/sessions/:id sets binned_at instead of removing the row, so the session and its
// recordings come back with POST /api/sessions/:id/restore. A sweep removes sessions binned more than 30 days ago,
// raw files included (lib/sessions/bin.ts).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('practice_sessions', (table) => {
    table.datetime('binned_at', { precision: 3 }).nullable();
    table.index(['binned_at'], 'practice_sessions_binned_at_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('practice_sessions', (table) => {
    table.dropIndex(['binned_at'], 'practice_sessions_binned_at_index');
    table.dropColumn('binned_at');
  });
}
