// The demo's launch-monitor shots (invented): Ada Fenwick's lesson (session 1) with a shot log in our own plain
// layout, imported through the same code as an upload (raw file into the store, parse, offset, pairing). The log's
// clock runs 37.42 s ahead of the insoles'; one swing has no shot (the monitor missed the read) and one shot has no
// swing (hit with the insoles switched off), so the matching has something to find. The values are invented; ball
// speed and carry rise with the pressure on the lead foot at impact so the "what goes with distance" view has a
// pattern to show. Also a saved shot profile for a semicolon-separated log with decimal commas, mph and yards.
import { createHash } from 'node:crypto';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Knex } from 'knex';
import { DEFAULT_SHOT_PROFILE, type ShotProfile } from '../../lib/contracts/shots';
import { parseShotLog } from '../../lib/shots/parse';
import { saveImport, sessionImpacts } from '../../lib/shots/session-shots';
import type { RawFileStore } from '../../lib/storage/types';

const COACH_USER_ID = 2;
const SESSION_ID = 1;
const SESSION_DATE = '2026-02-10';
export const DEMO_SHOT_OFFSET_S = 37.42;

export const DEMO_SHOT_PROFILE: { name: string; profile: ShotProfile } = {
  name: 'Bay 2 monitor (semicolon, mph, yd)',
  profile: {
    delimiter: ';',
    decimal: ',',
    columns: { time: 'Time', club: 'Club', ball_speed: 'Ball mph', carry: 'Carry yd', total: 'Total yd', launch_angle: 'Launch', spin: 'Spin', offline: 'Side yd' },
    units: { ball_speed: 'mph', carry: 'yd', total: 'yd', offline: 'yd', launch_angle: 'deg', spin: 'rpm' },
  },
};

/** Deterministic pseudo-noise in [-0.5, 0.5) (an LCG; no shared random state). */
function noise(seed: number): () => number {
  let s = seed;
  return () => {
    s = (1103515245 * s + 12345) % 2 ** 31;
    return s / 2 ** 31 - 0.5;
  };
}

const fmt = (v: number, d: number) => v.toFixed(d);

export async function seedDemoShots(knex: Knex, store: RawFileStore): Promise<number> {
  await knex('shot_profiles').insert({ coach_user_id: COACH_USER_ID, name: DEMO_SHOT_PROFILE.name, profile: JSON.stringify(DEMO_SHOT_PROFILE.profile) });
  const impacts = (await sessionImpacts(knex, SESSION_ID)).filter((i) => i.impactS !== null);
  if (impacts.length < 3) return 0;
  const ids = impacts.map((i) => i.swingId);
  const [leads, labels] = await Promise.all([
    knex('swing_event_values').whereIn('swing_id', ids).andWhere({ event: 'impact' }).select('swing_id', 'lead_pct'),
    knex('swing_labels').whereIn('swing_id', ids).select('swing_id', 'club'),
  ]);
  const leadAt = new Map(leads.map((r) => [Number(r.swing_id), Number(r.lead_pct)]));
  const clubOf = new Map(labels.map((r) => [Number(r.swing_id), String(r.club)]));
  const rnd = noise(2026);
  const lines: string[] = [];
  impacts.forEach((imp, k) => {
    if (k === 3) return; // the monitor missed this one
    const club = clubOf.get(imp.swingId) ?? 'iron-7';
    const driver = club === 'driver';
    const lead = leadAt.get(imp.swingId) ?? 70;
    const ball = (driver ? 62 : 50) + 0.12 * (lead - 70) + 1.2 * rnd(); // m/s
    const carry = ball * (driver ? 3.6 : 2.95) + 3 * rnd(); // m
    const when = new Date((imp.impactS! + DEMO_SHOT_OFFSET_S + 0.02 * rnd()) * 1000).toISOString().replace('Z', '');
    lines.push([when, club, fmt(ball, 2), fmt(carry, 1), fmt(carry * 1.08, 1), fmt(driver ? 12 + 2 * rnd() : 17 + 2 * rnd(), 1), fmt(driver ? 2600 + 300 * rnd() : 6600 + 500 * rnd(), 0), fmt(6 * rnd(), 1)].join(','));
  });
  // a shot with the insoles switched off, between the third and fourth swings
  const extraAt = new Date((impacts[2].impactS! + 9.5 + DEMO_SHOT_OFFSET_S) * 1000).toISOString().replace('Z', '');
  lines.push([extraAt, 'iron-7', '49.80', '146.2', '157.9', '17.6', '6710', '-2.4'].join(','));
  lines.sort();
  const columns = DEFAULT_SHOT_PROFILE.columns;
  const header = [columns.time, columns.club, columns.ball_speed, columns.carry, columns.total, columns.launch_angle, columns.spin, columns.offline].join(',');
  const csv = `# format: stanceline-shots/1\n${header}\n${lines.join('\n')}\n`;
  const dir = mkdtempSync(join(tmpdir(), 'stanceline-demo-shots-'));
  try {
    const path = join(dir, 'ada-lesson-shots.csv');
    writeFileSync(path, csv);
    const key = 'demo/shots-session-1.csv';
    await store.putFile(key, path, Buffer.byteLength(csv));
    const shots = parseShotLog(csv, DEFAULT_SHOT_PROFILE, SESSION_DATE, false);
    const result = await saveImport(
      knex,
      { sessionId: SESSION_ID, uploadedBy: COACH_USER_ID, filename: 'ada-lesson-shots.csv', byteSize: Buffer.byteLength(csv), sha256: createHash('sha256').update(csv).digest('hex'), storageKey: key, profile: DEFAULT_SHOT_PROFILE },
      shots,
    );
    return result.matched;
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
