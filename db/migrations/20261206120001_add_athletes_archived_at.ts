import type { Knex } from 'knex';

// An archived player leaves the roster and every pick list, keeping all their data; POST /api/athletes/:id/restore brings them back.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('athletes', (table) => {
    table.datetime('archived_at', { precision: 3 }).nullable();
    table.index(['archived_at'], 'athletes_archived_at_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('athletes', (table) => {
    table.dropIndex(['archived_at'], 'athletes_archived_at_index');
    table.dropColumn('archived_at');
  });
}
