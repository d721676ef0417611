import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Knex } from 'knex';
import Papa from 'papaparse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import { generateSession } from '@/lib/signal/synthetic';
import { createLocalStore } from '@/lib/storage';
import { drainQueue } from '@/lib/jobs/worker';
import { insertRecording, resetDemo, tempDir, testDb } from './support/recordings';

// Research exports on a real MariaDB, through the same code the route streams with:
// - only consented players, under codes, and none of the personal text in the database anywhere in the bytes;
// - a revocation empties the next export; a minor's sessions need the guardian's consent too;
// - the numbers equal `npm run analyze` on the same file with the same parameters (scripts/analyze.ts);
// - Debian's python3-pandas (pandas.read_csv, no options) reads the CSV with numeric columns as numbers and the row
//   count of the tidy (long) shape: one row per swing x event-or-phase x measure (Wickham 2014, Tidy Data, J Stat
//   Softw 59(10)). R is not installed on this machine, so R's read.csv is not run here.

process.env.DATABASE_URL ||= inject('databaseUrl');
process.env.RESEARCH_CODE_SECRET ||= 'integration-test-research-secret-0123456789';

let db: Knex;
const store = createLocalStore(tempDir('research-store'));
const dir = mkdtempSync(join(tmpdir(), 'stanceline-research-'));
const golf = generateSession({ seed: 41, sampleRateHz: 100, sensorsPerFoot: 8, units: 'N', handedness: 'right', stanceWidthMm: 380, swings: 3, withMarker: true });
const FILE_NAME = 'ada-research-block-41.csv';
let recordingId = 0;

const researcher = { id: 5, role: 'researcher' as const, academyId: 1, name: 'R', email: 'r@x', tokenId: null };
const coach = { id: 2, role: 'coach' as const, academyId: 1, name: 'C', email: 'c@x', tokenId: null };
const student = { id: 4, role: 'student' as const, academyId: 1, name: 'S', email: 's@x' };

async function lib() {
  const [exp, consent] = await Promise.all([import('@/lib/research/export'), import('@/lib/research/consent')]);
  return { ...exp, ...consent };
}

async function exportText(viewer: typeof researcher | typeof coach, query: { format: 'csv' | 'json'; shape: 'long' | 'wide' }, filter = {}) {
  const { startExport } = await lib();
  const stream = await startExport(viewer, { partial: 'include', ...filter }, query);
  return new Response(stream).text();
}

beforeAll(async () => {
  db = testDb();
  await resetDemo(db);
  ({ recordingId } = await insertRecording(db, store, golf.csv(), { handedness: 'right', stanceWidthMm: 380 }, FILE_NAME));
  expect(await drainQueue({ db, store, workerId: 'research-test', pollMs: 50, lockTimeoutS: 30 })).toBe(1);
  const { setConsent } = await lib();
  await setConsent(student, 1, { research: true }); // Ada Fenwick, an adult (born 1994), consents for herself
});
afterAll(async () => {
  rmSync(dir, { recursive: true, force: true });
  await resetDemo(db);
  await db.destroy();
});

describe('phase-table export', () => {
  it('holds only consented players, under codes; no personal text of the database is anywhere in its bytes', async () => {
    const swings = await db('swings').where({ recording_id: recordingId, hidden: false }).count({ n: '*' });
    const n = Number(swings[0].n);
    expect(n).toBe(3); // the generator's three swings
    const texts = await Promise.all([
      exportText(researcher, { format: 'csv', shape: 'long' }),
      exportText(researcher, { format: 'csv', shape: 'wide' }),
      exportText(researcher, { format: 'json', shape: 'long' }),
      exportText(researcher, { format: 'json', shape: 'wide' }),
    ]);
    const wide = Papa.parse<Record<string, string>>(texts[1].trim(), { header: true }).data;
    expect(wide).toHaveLength(n);
    expect(new Set(wide.map((r) => r.player_code)).size).toBe(1);
    expect(wide[0].player_code).toMatch(/^P[0-9a-f]{12}$/);
    expect(wide[0].session_week).toBe('2026-W07'); // session 1 of the demo is on 2026-02-10
    expect(wide[0].age_band).toBe('30-34'); // born 1994-03-12: 31 on 2026-02-10

    const personal: unknown[] = [];
    for (const a of await db('athletes').select('display_name', 'home_club', 'date_of_birth')) personal.push(a.display_name, a.home_club, a.date_of_birth);
    for (const u of await db('users').select('name', 'email')) personal.push(u.name, u.email);
    for (const p of await db('practice_sessions').select('location', 'notes', 'session_date')) personal.push(p.location, p.notes, p.session_date);
    for (const r of await db('recordings').select('filename', 'storage_key')) personal.push(r.filename, r.storage_key);
    const needles = personal.filter((v): v is string | Date => v !== null && v !== undefined).map((v) => (v instanceof Date ? v.toISOString().slice(0, 10) : String(v)));
    expect(needles).toContain(FILE_NAME);
    expect(needles).toContain('Ada Fenwick');
    for (const text of texts) {
      const bytes = Buffer.from(text, 'utf8');
      for (const needle of needles) expect(bytes.includes(Buffer.from(needle, 'utf8')), `export holds "${needle}"`).toBe(false);
    }
  });

  it('equals `npm run analyze` on the same file with the same parameters', async () => {
    const file = join(dir, FILE_NAME);
    writeFileSync(file, golf.csv());
    const run = spawnSync(process.execPath, ['--import', 'tsx', 'scripts/analyze.ts', file, '--handedness', 'right', '--stance-width-mm', '380'], { encoding: 'utf8' });
    expect(run.status, run.stderr).toBe(0);
    const analysis = JSON.parse(run.stdout);
    const text = await exportText(researcher, { format: 'json', shape: 'long' });
    const doc = JSON.parse(text) as { rows: Record<string, string | number | null>[]; rowCount: number };
    const swingIds = (await db('swings').where({ recording_id: recordingId }).orderBy('swing_index').select('id')).map((s) => Number(s.id));
    expect(analysis.swings).toHaveLength(swingIds.length);
    let compared = 0;
    for (const [k, sw] of analysis.swings.entries()) {
      const rows = doc.rows.filter((r) => r.swing_id === swingIds[k]);
      for (const r of rows) {
        const where = String(r.event_or_phase);
        const measure = String(r.measure);
        let expected: number | null;
        if (where === 'swing') expected = sw.tempo_ratio;
        else if (measure === 'time_s') expected = sw.events[where];
        else if (['backswing', 'downswing', 'follow-through'].includes(where) || (where === 'transition' && ['duration_s', 'cop_path_mm', 'peak_cop_speed_mm_s', 'mean_lead_pct'].includes(measure)))
          expected = sw.phases.find((p: { name: string }) => p.name === where)[measure];
        else expected = sw.at_events[where][measure];
        expect(r.value, `swing ${k + 1} ${where} ${measure}`).toBe(expected);
        compared += 1;
      }
      expect(rows[0].cutoff_hz).toBe(analysis.processing.cutoff_hz);
      expect(rows[0].sample_rate_hz).toBe(analysis.processing.sample_rate_hz);
      expect(rows[0].stance_width_mm).toBe(analysis.processing.stance_width_mm);
      expect(rows[0].algorithm_version).toBe(analysis.processing.algorithm_version);
      expect(rows[0].partial).toBe(sw.partial ? 1 : 0);
    }
    expect(compared).toBe(swingIds.length * 47);
    expect(doc.rowCount).toBe(compared);
  });

  it('pandas.read_csv reads both shapes with numeric columns as numbers and the expected row counts', async () => {
    const long = join(dir, 'long.csv');
    const wide = join(dir, 'wide.csv');
    writeFileSync(long, await exportText(researcher, { format: 'csv', shape: 'long' }));
    writeFileSync(wide, await exportText(researcher, { format: 'csv', shape: 'wide' }));
    const script = [
      'import json, sys, pandas',
      'out = {}',
      'for name in sys.argv[1:]:',
      '    df = pandas.read_csv(name)',
      '    out[name] = {"rows": int(len(df)), "dtypes": {c: str(t) for c, t in df.dtypes.items()}}',
      'print(json.dumps(out))',
    ].join('\n');
    const r = spawnSync('/usr/bin/python3', ['-c', script, long, wide], { encoding: 'utf8' });
    expect(r.status, r.stderr).toBe(0);
    const out = JSON.parse(r.stdout) as Record<string, { rows: number; dtypes: Record<string, string> }>;
    expect(out[long].rows).toBe(3 * 47); // 3 swings x (5 events x 6 + 4 phases x 4 + tempo)
    expect(out[wide].rows).toBe(3);
    const L = out[long].dtypes;
    expect(L.value).toBe('float64');
    expect(L.swing_id).toBe('int64');
    expect(L.partial).toBe('int64');
    for (const c of ['cutoff_hz', 'sample_rate_hz', 'max_gap_s', 'stance_width_mm', 'filter_order', 'derivative_window']) expect(['int64', 'float64']).toContain(L[c]);
    for (const c of ['player_code', 'session_week', 'context', 'club', 'event_or_phase', 'measure', 'unit', 'algorithm_version', 'age_band']) expect(L[c]).toBe('object');
    const W = out[wide].dtypes;
    for (const [c, t] of Object.entries(W)) {
      if (/_(s|pct|mm|mm_s)$/.test(c) || c === 'tempo_ratio') expect(['int64', 'float64'], c).toContain(t);
    }
  });

  it('a revocation removes the player from the next export; the audit keeps every export and the consent history', async () => {
    const { setConsent, getConsent, listExportAudit } = await lib();
    const before = await exportText(researcher, { format: 'csv', shape: 'wide' });
    expect(before.trim().split('\r\n')).toHaveLength(4);
    const after = await setConsent(coach, 1, { research: false });
    expect(after.research).toBe(false);
    expect(after.history.map((h) => h.research).slice(0, 2)).toEqual([false, true]); // newest first
    expect(after.history[1].recordedByRole).toBe('student');
    const next = await exportText(researcher, { format: 'csv', shape: 'wide' });
    expect(next.trim().split('\r\n')).toHaveLength(1); // the header only
    const audit = await listExportAudit(researcher);
    expect(audit[0]).toMatchObject({ status: 'completed', players: 0, swings: 0, rows: 0, shape: 'wide', format: 'csv' });
    expect(audit[1]).toMatchObject({ status: 'completed', players: 1, swings: 3, rows: 3 });
    await setConsent(student, 1, { research: true });
    expect((await getConsent(student, 1)).history).toHaveLength(after.history.length + 1);
  });

  it('a player who was a minor at the session needs the guardian’s consent as well', async () => {
    const { setConsent } = await lib();
    await db('athletes').where({ id: 1 }).update({ date_of_birth: '2010-06-04' }); // 15 on 2026-02-10
    const view = await setConsent(coach, 1, { research: true });
    expect(view.guardianNeeded).toBe(true);
    expect(view.sessionsIncluded).toBe(0);
    expect((await exportText(researcher, { format: 'csv', shape: 'wide' })).trim().split('\r\n')).toHaveLength(1);
    const withGuardian = await setConsent(coach, 1, { research: true, guardianConsent: true });
    expect(withGuardian.sessionsIncluded).toBe(withGuardian.sessionsTotal);
    const rows = Papa.parse<Record<string, string>>((await exportText(researcher, { format: 'csv', shape: 'wide' })).trim(), { header: true }).data;
    expect(rows).toHaveLength(3);
    expect(rows[0].age_band).toBe('15-17');
  });

  it('a coach’s own export is identified; filters narrow the cohort', async () => {
    const rows = Papa.parse<Record<string, string>>((await exportText(coach, { format: 'csv', shape: 'wide' })).trim(), { header: true }).data;
    expect(rows).toHaveLength(3);
    expect(rows[0].player_name).toBe('Ada Fenwick');
    expect(rows[0].session_date).toBe('2026-02-10');
    const none = await exportText(researcher, { format: 'csv', shape: 'wide' }, { context: 'on-course' });
    expect(none.trim().split('\r\n')).toHaveLength(1);
    const lefties = await exportText(researcher, { format: 'csv', shape: 'wide' }, { handedness: 'left' });
    expect(lefties.trim().split('\r\n')).toHaveLength(1);
    const irons = await exportText(researcher, { format: 'csv', shape: 'wide' }, { clubGroup: 'irons', from: '2026-02-01', to: '2026-02-28' });
    expect(irons.trim().split('\r\n')).toHaveLength(4); // unlabelled swings count as irons
  });
});
