import type { Knex } from 'knex';

// Every state change of a review: from, to, who (a user, or the payments provider when actor_user_id is null), when.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('review_history', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.increments('id').primary();
    table.integer('review_id').unsigned().notNullable().references('id').inTable('reviews').onDelete('CASCADE');
    table.string('from_status', 20).nullable();
    table.string('to_status', 20).notNullable();
    table.integer('actor_user_id').unsigned().nullable().references('id').inTable('users').onDelete('SET NULL');
    table.string('actor_kind', 20).notNullable();
    table.datetime('at', { precision: 3 }).notNullable();
    table.index(['review_id', 'id'], 'review_history_review_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('review_history');
}
