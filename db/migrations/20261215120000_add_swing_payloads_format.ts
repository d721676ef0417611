import type { Knex } from 'knex';

// swing_payloads.format: which form of the swing's stored part a row holds (lib/swings/payload-build.ts
// SWING_PART_FORMAT). Form 2 adds the swing's events, the values at them and its phase table, which GET
// /api/swings/:id used to assemble from three subqueries on every request. A row of an older form is rebuilt on its
// next read, so a change of form needs no data migration.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('swing_payloads', (table) => {
    table.smallint('format').unsigned().notNullable().defaultTo(1);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('swing_payloads', (table) => {
    table.dropColumn('format');
  });
}
