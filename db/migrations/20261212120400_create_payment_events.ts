import type { Knex } from 'knex';

// Webhook events already handled, by the provider's event id: a replay finds its row and is answered without acting.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('payment_events', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.string('event_id', 255).primary();
    table.string('type', 100).notNullable();
    table.string('outcome', 40).notNullable();
    table.datetime('received_at', { precision: 3 }).notNullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('payment_events');
}
