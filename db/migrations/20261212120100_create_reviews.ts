import type { Knex } from 'knex';

export const REVIEW_STATUSES = ['requested', 'awaiting_payment', 'paid', 'in_review', 'delivered', 'cancelled', 'refunded'] as const;

// A student's paid request for a remote review of one recording; price and turnaround are copied from the offer.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('reviews', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.increments('id').primary();
    table.integer('academy_id').unsigned().notNullable().references('id').inTable('academies').onDelete('RESTRICT');
    table.integer('athlete_id').unsigned().notNullable().references('id').inTable('athletes').onDelete('CASCADE');
    table.integer('student_user_id').unsigned().notNullable().references('id').inTable('users').onDelete('CASCADE');
    table.integer('coach_user_id').unsigned().notNullable().references('id').inTable('users').onDelete('RESTRICT');
    table.integer('recording_id').unsigned().notNullable().references('id').inTable('recordings').onDelete('CASCADE');
    table.string('question', 2000).notNullable();
    table.enu('status', [...REVIEW_STATUSES]).notNullable();
    table.integer('price_cents').unsigned().notNullable();
    table.specificType('currency', 'char(3)').notNullable();
    table.tinyint('turnaround_days').unsigned().notNullable();
    table.string('checkout_session_id', 255).nullable().unique({ indexName: 'reviews_checkout_session_unique' });
    table.string('payment_intent_id', 255).nullable();
    table.datetime('due_at', { precision: 3 }).nullable();
    table.text('summary').nullable();
    table.integer('drill_id').unsigned().nullable().references('id').inTable('drills').onDelete('SET NULL');
    table.datetime('created_at', { precision: 3 }).notNullable();
    table.datetime('updated_at', { precision: 3 }).notNullable();
    table.index(['coach_user_id', 'status', 'due_at'], 'reviews_queue_index');
    table.index(['student_user_id', 'created_at'], 'reviews_student_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('reviews');
}
