// Benchmark of the research export (npm run bench:export). Prints figures; asserts nothing. It starts its own throwaway
// MariaDB, seeds the demo, adds one processed-looking recording with enough invented swings for about 100,000 rows of
// the long table on a consenting player, streams the long CSV and the wide JSON through lib/research/export.ts and
// reports rows, bytes, time and the live heap during the stream (after forced collections) against the heap before
// it (bounded memory: the growth should stay near one batch, whatever the row count). The numbers in the rows are invented filler, not measurements.
import knex from 'knex';
import { knexConfig } from '../knexfile';
import { migrateLatest, seedDemoAt } from './lib/database';
import { startThrowawayMariadb } from './lib/throwaway-mariadb';

const TARGET_ROWS = 100_000;
const ROWS_PER_SWING = 47;
const mb = (bytes: number) => (bytes / (1024 * 1024)).toFixed(1);

function prng(seed: number) {
  let s = seed >>> 0;
  return () => ((s = (s * 1664525 + 1013904223) >>> 0) / 2 ** 32);
}

async function fill(databaseUrl: string, swings: number): Promise<void> {
  const db = knex(knexConfig(databaseUrl));
  try {
    const rnd = prng(15);
    const parameters = { handedness: 'right', stance_width_mm: 380, cutoff_hz: 20, filter_order: 2, derivative_window: 11, derivative_poly_order: 2, max_gap_s: 0.1, sample_rate_hz: 100 };
    await db('recordings').insert({ id: 900, athlete_id: 1, session_id: 1, uploaded_by: 2, filename: 'bench.csv', byte_size: 1, sha256: '0'.repeat(64), storage_key: 'bench/none', status: 'ready', options: '{}', parameters: JSON.stringify(parameters), algorithm_version: 'bench' });
    for (let start = 0; start < swings; start += 500) {
      const n = Math.min(500, swings - start);
      const ids = Array.from({ length: n }, (_, k) => 10_000 + start + k);
      await db('swings').insert(ids.map((id, k) => ({ id, recording_id: 900, swing_index: start + k + 1, start_s: id, end_s: id + 3, impact_source: 'detected', tempo_ratio: 2.5 + rnd() })));
      await db('swing_events').insert(ids.flatMap((id) => ['address', 'top', 'transition', 'impact', 'finish'].map((name, e) => ({ swing_id: id, name, time_s: id + 0.5 + e * 0.4, source: 'auto', auto_time_s: id + 0.5 + e * 0.4 }))));
      await db('swing_event_values').insert(ids.flatMap((id) => ['address', 'top', 'transition', 'impact', 'finish'].map((event) => ({ swing_id: id, event, lead_pct: 100 * rnd(), lead_heel_pct: 100 * rnd(), trail_heel_pct: 100 * rnd(), cop_x_mm: 200 * rnd() - 100, cop_y_mm: 100 * rnd() - 50 }))));
      await db('swing_phase_metrics').insert(ids.flatMap((id) => ['backswing', 'transition', 'downswing', 'follow-through'].map((phase) => ({ swing_id: id, phase, duration_s: rnd(), cop_path_mm: 300 * rnd(), peak_cop_speed_mm_s: 1500 * rnd(), mean_lead_pct: 100 * rnd() }))));
    }
  } finally {
    await db.destroy();
  }
}

async function main(): Promise<void> {
  console.log(`# Stanceline research export benchmark (node ${process.version}, ${new Date().toISOString()})`);
  const database = await startThrowawayMariadb(process.cwd());
  try {
    await migrateLatest(database.databaseUrl);
    await seedDemoAt(database.databaseUrl);
    const swings = Math.ceil(TARGET_ROWS / ROWS_PER_SWING);
    await fill(database.databaseUrl, swings);
    process.env.DATABASE_URL = database.databaseUrl;
    process.env.RESEARCH_CODE_SECRET = 'bench-research-code-secret-0123456789abcdef';
    const { startExport } = await import('../lib/research/export');
    const viewer = { id: 5, role: 'researcher' as const, academyId: 1, name: 'bench', email: 'bench@stanceline.test', tokenId: null };
    for (const query of [{ format: 'csv', shape: 'long' }, { format: 'json', shape: 'wide' }] as const) {
      globalThis.gc?.();
      const before = process.memoryUsage().heapUsed;
      let peak = before;
      let retained = before; // heap after a forced collection, every 5th chunk: what the stream really holds
      let chunks = 0;
      let bytes = 0;
      let newlines = 0;
      const t0 = performance.now();
      const reader = (await startExport(viewer, { partial: 'include' }, query)).getReader();
      for (;;) {
        const { done, value } = await reader.read();
        if (done) break;
        bytes += value.byteLength;
        for (const b of value) if (b === 10) newlines += 1;
        peak = Math.max(peak, process.memoryUsage().heapUsed);
        if (++chunks % 5 === 0 && globalThis.gc) {
          globalThis.gc();
          retained = Math.max(retained, process.memoryUsage().heapUsed);
        }
      }
      const s = (performance.now() - t0) / 1000;
      const rows = query.format === 'csv' ? newlines - 1 : swings;
      console.log(`${query.shape} ${query.format}: ${rows} rows, ${mb(bytes)} MB in ${s.toFixed(2)} s (${Math.round(rows / s)} rows/s); heap before ${mb(before)} MB; live heap after collections at most ${mb(retained)} MB (+${mb(retained - before)} MB); peak including garbage ${mb(peak)} MB; the output itself is ${mb(bytes)} MB`);
    }
    const { db } = await import('../lib/db/client');
    await db.destroy();
  } finally {
    await database.dispose();
  }
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
