import type { Knex } from 'knex';

// The shots of an import, values in SI units (m/s, m, degrees, rpm; README "Shot logs"). device_time_s is the shot's
// time on the launch monitor's clock. swing_id is its pair; pairing says who made it ('auto' from the offset,
// 'manual' by the coach, 'unpaired' when the coach took an automatic pair away: a re-pairing leaves it alone).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('shots', (table) => {
    table.charset('utf8mb4');
    table.collate('utf8mb4_unicode_ci');
    table.increments('id').primary();
    table.integer('import_id').unsigned().notNullable().references('id').inTable('shot_imports').onDelete('CASCADE');
    table.integer('shot_index').unsigned().notNullable();
    table.integer('line').unsigned().notNullable();
    table.double('device_time_s').notNullable();
    table.string('time_text', 64).notNullable();
    table.string('club', 40).nullable();
    table.double('ball_speed_m_s').nullable();
    table.double('carry_m').nullable();
    table.double('total_m').nullable();
    table.double('launch_angle_deg').nullable();
    table.double('spin_rpm').nullable();
    table.double('offline_m').nullable();
    table.integer('swing_id').unsigned().nullable().references('id').inTable('swings').onDelete('SET NULL');
    table.enu('pairing', ['auto', 'manual', 'unpaired']).notNullable().defaultTo('auto');
    table.unique(['import_id', 'shot_index'], { indexName: 'shots_import_index_unique' });
    table.index(['swing_id'], 'shots_swing_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('shots');
}
