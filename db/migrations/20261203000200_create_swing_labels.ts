import type { Knex } from 'knex';

const CLUBS = ['driver', 'wood', 'hybrid', 'iron-3', 'iron-4', 'iron-5', 'iron-6', 'iron-7', 'iron-8', 'iron-9', 'wedge'] as const;
const STRIKES = ['solid', 'fat', 'thin', 'topped'] as const;
const FLIGHTS = ['push', 'pull', 'slice', 'hook', 'fade', 'draw', 'straight'] as const;

// A coach's labels of one swing: club, strike and ball-flight outcome (golf trade terms), free tags (JSON array of
// strings) and a 1-5 rating. "Not a swing" is swings.hidden (so every swing list already sees it), not a column here.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('swing_labels', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.integer('swing_id').unsigned().primary().references('id').inTable('swings').onDelete('CASCADE');
    table.enu('club', CLUBS).nullable();
    table.enu('strike', STRIKES).nullable();
    table.enu('flight', FLIGHTS).nullable();
    table.text('tags').notNullable();
    table.tinyint('rating').unsigned().nullable();
    table.integer('updated_by').unsigned().nullable().references('id').inTable('users').onDelete('SET NULL');
    table.datetime('updated_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('swing_labels');
}
