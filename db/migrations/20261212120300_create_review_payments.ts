import type { Knex } from 'knex';

// Money in (kind payment) and out (kind refund) for a review, as the payments provider confirmed it. provider_ref is
// the checkout session id for a payment and the refund id for a refund: unique, so a replayed event cannot add a row.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('review_payments', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.increments('id').primary();
    table.integer('review_id').unsigned().notNullable().references('id').inTable('reviews').onDelete('RESTRICT');
    table.integer('coach_user_id').unsigned().notNullable().references('id').inTable('users').onDelete('RESTRICT');
    table.integer('academy_id').unsigned().notNullable().references('id').inTable('academies').onDelete('RESTRICT');
    table.enu('kind', ['payment', 'refund']).notNullable();
    table.integer('amount_cents').unsigned().notNullable();
    table.specificType('currency', 'char(3)').notNullable();
    table.string('provider_ref', 255).notNullable().unique({ indexName: 'review_payments_provider_ref_unique' });
    table.datetime('created_at', { precision: 3 }).notNullable();
    table.index(['academy_id', 'created_at'], 'review_payments_academy_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('review_payments');
}
