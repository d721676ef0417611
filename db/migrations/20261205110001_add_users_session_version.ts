import type { Knex } from 'knex';

// A user's session version: every session token carries the version it was issued under, and the server refuses a
// token whose version is not the user's current one. Sign-out and deactivation add 1, so a copied token dies with
// sign-out and a reactivated account does not bring its old tokens back.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('users', (table) => {
    table.integer('session_version').unsigned().notNullable().defaultTo(0);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('users', (table) => {
    table.dropColumn('session_version');
  });
}
