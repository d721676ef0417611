import type { Knex } from 'knex';

// A coach's price and turnaround for a remote review (one row per coach; PUT /api/review-offer replaces it).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('review_offers', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.integer('coach_user_id').unsigned().primary().references('id').inTable('users').onDelete('CASCADE');
    table.integer('price_cents').unsigned().notNullable();
    table.specificType('currency', 'char(3)').notNullable();
    table.tinyint('turnaround_days').unsigned().notNullable();
    table.datetime('updated_at', { precision: 3 }).notNullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('review_offers');
}
