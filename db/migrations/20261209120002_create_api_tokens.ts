import type { Knex } from 'knex';

// Personal API tokens (export routes only). Only the SHA-256 of the token is stored; the token itself is shown once.
// A revoked token keeps its row (revoked_at) so the export audit can still name it.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('api_tokens', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.increments('id').primary();
    table.integer('user_id').unsigned().notNullable().references('id').inTable('users').onDelete('CASCADE');
    table.string('name', 80).notNullable();
    table.specificType('token_hash', 'char(64)').notNullable().unique({ indexName: 'api_tokens_hash_unique' });
    table.string('prefix', 16).notNullable();
    table.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    table.datetime('last_used_at', { precision: 3 }).nullable();
    table.datetime('revoked_at', { precision: 3 }).nullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('api_tokens');
}
