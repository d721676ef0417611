import type { Knex } from 'knex';

// A coach stops taking review requests: DELETE /api/review-offer sets withdrawn_at (the row keeps its price, currency
// and turnaround, so the coach can offer it again); students no longer see the offer; PUT clears it.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('review_offers', (table) => {
    table.datetime('withdrawn_at', { precision: 3 }).nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('review_offers', (table) => {
    table.dropColumn('withdrawn_at');
  });
}
