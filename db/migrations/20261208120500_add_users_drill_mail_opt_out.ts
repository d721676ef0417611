import type { Knex } from 'knex';

// A student's choice not to receive drill reminder mails (assigned, or due tomorrow).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('users', (table) => {
    table.boolean('drill_mail_opt_out').notNullable().defaultTo(false);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('users', (table) => {
    table.dropColumn('drill_mail_opt_out');
  });
}
