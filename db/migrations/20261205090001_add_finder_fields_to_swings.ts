import type { Knex } from 'knex';

// What the swing finder says about each swing beyond its events: partial (a pitch or half swing), the forward press
// before the takeaway (start and size), and whether a coach asked for it ('detected' with relaxed checks, 'placed').
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('swings', (table) => {
    table.boolean('partial').notNullable().defaultTo(false);
    table.double('forward_press_s').nullable();
    table.double('forward_press_mm').nullable();
    table.enu('promoted', ['detected', 'placed']).nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('swings', (table) => {
    table.dropColumn('promoted');
    table.dropColumn('forward_press_mm');
    table.dropColumn('forward_press_s');
    table.dropColumn('partial');
  });
}
