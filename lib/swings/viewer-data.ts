import 'server-only';
import type { OverlayOption, SwingView } from '@/lib/contracts/swings';
import { db } from '@/lib/db/client';
import { toIsoDate } from '@/lib/db/values';
import { sessionSwingNumbers } from '@/lib/recordings/views';

// The correction log of GET /api/swings/:id, and the overlay pick-list (GET /api/swings/:id/overlay-options), kept
// out of the swing's own request because it reads every swing of the athlete. The heavy part every reader shares is built in lib/swings/payload-build.ts.

/** The athlete's other swings for the overlay pick-list (GET /api/swings/:id/overlay-options). */
export async function overlayOptions(swingId: number, athleteId: number): Promise<OverlayOption[]> {
  const same = await db('swings as s')
    .join('recordings as r', 'r.id', 's.recording_id')
    .join('practice_sessions as p', 'p.id', 'r.session_id')
    .leftJoin('swing_labels as l', 'l.swing_id', 's.id')
    .where('r.athlete_id', athleteId)
    .whereNull('r.binned_at')
    .whereNull('p.binned_at')
    .andWhere('s.hidden', false)
    .andWhere('s.stale', false)
    .andWhereNot('s.id', swingId)
    .orderBy([{ column: 'p.session_date', order: 'desc' }, { column: 'p.id', order: 'desc' }, { column: 'r.id', order: 'desc' }, { column: 's.swing_index', order: 'asc' }])
    .limit(200)
    .select('s.id', 's.swing_index', 'r.filename', 'p.id as session_id', 'p.session_date', 'p.context', 'p.location', 'l.club');
  // Grouped by session (newest first), each session's swings in time order with their session-wide number.
  const numbers = await sessionSwingNumbers([...new Set(same.map((s) => Number(s.session_id)))]);
  const sessionRank = new Map<number, number>();
  for (const s of same) if (!sessionRank.has(Number(s.session_id))) sessionRank.set(Number(s.session_id), sessionRank.size);
  const rows = same
    .map((s) => ({ s, n: numbers.get(Number(s.id)) ?? Number(s.swing_index) }))
    .sort((a, b) => sessionRank.get(Number(a.s.session_id))! - sessionRank.get(Number(b.s.session_id))! || a.n - b.n);
  const contextName: Record<string, string> = { lesson: 'lesson', practice: 'practice', 'on-course': 'on course' };
  return rows.map(({ s, n }) => ({
    id: Number(s.id),
    label: `Swing ${n}${s.club ? ` · ${String(s.club).replace(/^iron-(\d)$/, '$1-iron')}` : ''} · ${s.filename}`,
    group: `${toIsoDate(s.session_date)} · ${contextName[s.context] ?? s.context}${s.location ? ` · ${s.location}` : ''}`,
  }));
}

export async function correctionsView(swingId: number): Promise<SwingView['corrections']> {
  const rows = await db('swing_event_corrections as c')
    .leftJoin('users as u', 'u.id', 'c.user_id')
    .where('c.swing_id', swingId)
    .orderBy([{ column: 'c.at', order: 'desc' }, { column: 'c.id', order: 'desc' }])
    .select('c.event', 'c.from_s', 'c.to_s', 'c.kind', 'u.name', 'c.at');
  return rows.map((r) => ({
    event: r.event,
    fromS: Math.round(Number(r.from_s) * 1000) / 1000,
    toS: Math.round(Number(r.to_s) * 1000) / 1000,
    kind: r.kind,
    byName: r.name ?? 'Former user',
    at: new Date(r.at).toISOString(),
  }));
}
