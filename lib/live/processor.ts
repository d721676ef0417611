import 'server-only';
import { randomUUID } from 'node:crypto';
import { hostname } from 'node:os';
import { db } from '@/lib/db/client';
import type { LiveSwingEvent } from '@/lib/contracts/live';
import { resolveLayout } from '@/lib/recordings/options';
import { scoreSwing, type EventValues } from '@/lib/targets/score';
import { targetForSwing } from '@/lib/targets/store';
import { clubGroupOf } from '@/lib/targets/types';
import type { Handedness, SensorLayout } from '@/lib/signal/types';
import { EVENT_NAMES } from '@/lib/signal/types';
import type { LiveSwing } from './analyze-window';
import { LIVE_DEFAULTS, LiveFinder } from './finder';
import { chunkLevel } from './level';
import { runAnalyzeWindow } from './run-window';
import { metadataOf } from './validate';

// The live session's buffer, on the one instance that holds its lease (live_leases). The owner polls live_chunks
// every POLL_MS (ingest may reach any instance), feeds the chunks in sequence order to the LiveFinder, stops at a
// gap, writes the level and each settled swing (live_swings + a live_events row, one transaction), and renews the
// lease. When an owner dies its lease runs out after LEASE_S and the next instance that touches the session (a
// chunk, an event stream, the sweep) takes it and rebuilds the buffer from the stored chunks.

export const LEASE_S = 10;
const POLL_MS = 100;
const LEVEL_EVERY_MS = 100;

export const INSTANCE_ID = `${hostname()}:${process.pid}:${randomUUID().slice(0, 8)}`;

interface Held {
  finder: LiveFinder;
  nextSeq: number;
  number: number;
  startS: number | null;
  layout: SensorLayout;
  handedness: Handedness;
  units: 'N' | 'kPa';
  header: string;
  athleteId: number;
  academyId: number;
  lastLevelAt: number;
  timer: NodeJS.Timeout;
  leaseUntil: number;
}

const globalForLive = globalThis as typeof globalThis & { __stancelineLive?: Map<number, Held> };
const held: Map<number, Held> = (globalForLive.__stancelineLive ??= new Map());

/** Takes or renews the lease; false when another live instance holds it. */
async function takeLease(liveId: number): Promise<boolean> {
  const renewed = await db('live_leases')
    .where({ live_session_id: liveId })
    .andWhere((w) => w.where({ owner: INSTANCE_ID }).orWhere('expires_at', '<', db.raw('CURRENT_TIMESTAMP(3)')))
    .update({ owner: INSTANCE_ID, expires_at: db.raw(`CURRENT_TIMESTAMP(3) + INTERVAL ${LEASE_S} SECOND`) });
  if (renewed === 1) return true;
  try {
    await db('live_leases').insert({ live_session_id: liveId, owner: INSTANCE_ID, expires_at: db.raw(`CURRENT_TIMESTAMP(3) + INTERVAL ${LEASE_S} SECOND`) });
    return true;
  } catch (error) {
    const code = (error as { code?: string })?.code;
    if (code === 'ER_DUP_ENTRY') return false;
    // The live session is gone (deleted with its player or session): nothing to hold any more.
    if (code === 'ER_NO_REFERENCED_ROW_2' || code === 'ER_NO_REFERENCED_ROW') return false;
    throw error;
  }
}

function drop(liveId: number): void {
  const h = held.get(liveId);
  if (h) clearInterval(h.timer);
  held.delete(liveId);
}

/** Gives up the buffer (the session ended here or elsewhere). */
export async function releaseLive(liveId: number): Promise<void> {
  drop(liveId);
  await db('live_leases').where({ live_session_id: liveId, owner: INSTANCE_ID }).del();
}

async function build(liveId: number): Promise<Held | null> {
  const row = await db('live_sessions as l').join('athletes as a', 'a.id', 'l.athlete_id').where('l.id', liveId).first('l.*', 'a.handedness as profile_handedness', 'a.stance_width_mm as profile_width', 'a.academy_id');
  if (!row || row.status !== 'active' || row.preamble === null) return null;
  const meta = metadataOf(row.preamble);
  const layout = resolveLayout({ layout: null, profile: null, handedness: null, stanceWidthMm: null, cutoffHz: null }, meta);
  const handedness: Handedness = meta.handedness === 'left' || meta.handedness === 'right' ? meta.handedness : row.profile_handedness === 'left' ? 'left' : 'right';
  const finder = new LiveFinder({
    preamble: row.preamble,
    layout,
    options: { fallback: { handedness: row.profile_handedness ?? undefined, stanceWidthMm: row.profile_width ? Number(row.profile_width) : undefined } },
  });
  const last = await db('live_swings').where({ live_session_id: liveId }).orderBy('number', 'desc').first('number', 'impact_s');
  const first = await db('live_chunks').where({ live_session_id: liveId, seq: 0 }).first('first_time_s');
  let nextSeq = 0;
  if (last) {
    finder.resumeAfter(Number(last.impact_s));
    // rebuild only the rolling window before the last published swing
    const from = await db('live_chunks')
      .where({ live_session_id: liveId })
      .andWhere('last_time_s', '>=', Number(last.impact_s) - LIVE_DEFAULTS.windowS)
      .min({ s: 'seq' })
      .first();
    nextSeq = from?.s === null || from?.s === undefined ? 0 : Number(from.s);
  }
  const h: Held = {
    finder,
    nextSeq,
    number: last ? Number(last.number) : 0,
    startS: first?.first_time_s ?? null,
    layout,
    handedness,
    units: meta.units === 'kPa' ? 'kPa' : 'N',
    header: row.preamble.trimEnd().split('\n').pop() ?? '',
    athleteId: Number(row.athlete_id),
    academyId: Number(row.academy_id),
    lastLevelAt: 0,
    timer: setInterval(() => kickLive(liveId), POLL_MS),
    leaseUntil: Date.now() + LEASE_S * 1000,
  };
  h.timer.unref();
  return h;
}

const r1 = (v: number) => Math.round(v * 10) / 10;
const r3 = (v: number) => Math.round(v * 1000) / 1000;

async function publish(liveId: number, h: Held, w: LiveSwing): Promise<void> {
  const lastClub = await db('live_swings').where({ live_session_id: liveId }).whereNotNull('club').orderBy('number', 'desc').first('club');
  const target = await targetForSwing(h.athleteId, h.academyId, clubGroupOf(lastClub?.club ?? null));
  const values: EventValues = {};
  for (const e of EVENT_NAMES) {
    const a = w.atEvents[e];
    values[e] = { leadPct: a.lead_pct, leadHeelPct: a.lead_heel_pct, trailHeelPct: a.trail_heel_pct, copSide: (100 * a.cop_x_mm) / (Number(metadataOf(h.finder.cfg.preamble).stance_width_mm ?? 400) / 2) };
  }
  const scored = target ? scoreSwing(target, values, w.tempoRatio) : null;
  const t0 = h.startS ?? 0;
  const number = h.number + 1;
  const body: Omit<LiveSwingEvent, 'swingId' | 'labels'> = {
    number,
    events: Object.fromEntries(EVENT_NAMES.map((e) => [e, r3(w.events[e] - t0)])) as LiveSwingEvent['events'],
    values: {
      tempoRatio: Math.round(w.tempoRatio * 100) / 100,
      partial: w.partial,
      atEvents: Object.fromEntries(
        EVENT_NAMES.map((e) => [e, { leadPct: r1(w.atEvents[e].lead_pct), leadHeelPct: r1(w.atEvents[e].lead_heel_pct), trailHeelPct: r1(w.atEvents[e].trail_heel_pct) }]),
      ) as LiveSwingEvent['values']['atEvents'],
    },
    score: scored && target ? { targetName: target.name, commonPractice: target.commonPractice, checks: scored.checks, tempo: scored.tempo ?? null, summary: scored.summary } : null,
    trace: { t0: r3(w.trace.t0 - t0), dt: w.trace.dt, leadPct: w.trace.leadPct },
  };
  try {
    await db.transaction(async (trx) => {
      const [swingId] = await trx('live_swings').insert({ live_session_id: liveId, number, impact_s: w.events.impact, result: JSON.stringify(body) });
      const payload: LiveSwingEvent = { swingId: Number(swingId), ...body, labels: { club: null, strike: null, notSwing: false } };
      await trx('live_events').insert({ live_session_id: liveId, kind: 'swing', payload: JSON.stringify(payload) });
    });
    h.number = number;
  } catch (error) {
    if ((error as { code?: string })?.code !== 'ER_DUP_ENTRY') throw error;
    h.number = number; // another instance published it before losing the lease
  }
}

async function step(liveId: number): Promise<void> {
  if (!(await takeLease(liveId))) {
    drop(liveId);
    return;
  }
  let h = held.get(liveId);
  if (!h) {
    const built = await build(liveId);
    if (!built) {
      await releaseLive(liveId);
      return;
    }
    h = built;
    held.set(liveId, h);
  }
  const chunks = await db('live_chunks').where({ live_session_id: liveId }).andWhere('seq', '>=', h.nextSeq).orderBy('seq').limit(100).select('seq', 'body', 'first_time_s');
  let lastBody: string | null = null;
  for (const c of chunks) {
    if (Number(c.seq) !== h.nextSeq) break; // a gap: wait for the missing chunk
    if (h.startS === null && c.first_time_s !== null) h.startS = Number(c.first_time_s);
    h.finder.push(c.body);
    h.nextSeq++;
    lastBody = c.body;
    const input = h.finder.scanDue();
    if (input) for (const w of h.finder.accept(await runAnalyzeWindow(input))) await publish(liveId, h, w);
  }
  if (lastBody !== null && Date.now() - h.lastLevelAt >= LEVEL_EVERY_MS) {
    const level = chunkLevel(h.header, lastBody, h.layout, h.handedness, h.units);
    if (level) {
      h.lastLevelAt = Date.now();
      await db('live_leases').where({ live_session_id: liveId, owner: INSTANCE_ID }).update({ level: JSON.stringify({ ...level, t: r3(level.t - (h.startS ?? 0)) }) });
    }
  }
}

const running = new Set<number>();
const again = new Set<number>();

/** Work on this live session now (after a chunk arrived here, or on the owner's poll). Never throws. */
export function kickLive(liveId: number): void {
  if (running.has(liveId)) {
    again.add(liveId);
    return;
  }
  running.add(liveId);
  void (async () => {
    try {
      do {
        again.delete(liveId);
        await step(liveId);
      } while (again.has(liveId));
    } catch (error) {
      console.error(`[stanceline live] session ${liveId}:`, error);
    } finally {
      running.delete(liveId);
    }
  })();
}

/** Whether this instance holds the session's buffer now (for tests and the status line). */
export function holdsLive(liveId: number): boolean {
  return held.has(liveId);
}
