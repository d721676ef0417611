import type { Knex } from 'knex';

export const PHASE_NAMES = ['backswing', 'transition', 'downswing', 'follow-through'] as const;

// The phase table of a swing (lib/signal/phases.ts). Nullable numbers: a share with no load under it is undefined.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('swing_phase_metrics', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.increments('id').primary();
    table.integer('swing_id').unsigned().notNullable().references('id').inTable('swings').onDelete('CASCADE');
    table.enu('phase', PHASE_NAMES).notNullable();
    table.double('duration_s').nullable();
    table.double('cop_path_mm').nullable();
    table.double('peak_cop_speed_mm_s').nullable();
    table.double('mean_lead_pct').nullable();
    table.unique(['swing_id', 'phase'], { indexName: 'swing_phase_metrics_swing_phase_unique' });
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('swing_phase_metrics');
}
