import 'server-only';
import { db } from '@/lib/db/client';

// Read-only extras for the lesson summary: each swing's labels (club, rating) and the notes shared with the
// student (the lesson summary page, app/(app)/sessions/[id]/summary). Call only after the athlete access check (the
// page does); coach-only notes never leave here.

export interface SummaryLabels {
  club: string | null;
  strike: string | null;
  flight: string | null;
  rating: number | null;
}

export interface SharedNote {
  id: number;
  swingId: number;
  authorName: string;
  body: string;
  timeS: number | null;
  phase: string | null;
}

export async function summaryExtras(swingIds: number[]): Promise<{ labels: Map<number, SummaryLabels>; notes: SharedNote[] }> {
  if (swingIds.length === 0) return { labels: new Map(), notes: [] };
  const [labelRows, noteRows] = await Promise.all([
    db('swing_labels').whereIn('swing_id', swingIds).select('swing_id', 'club', 'strike', 'flight', 'rating'),
    db('swing_annotations as n')
      .leftJoin('users as u', 'u.id', 'n.author_user_id')
      .whereIn('n.swing_id', swingIds)
      .andWhere('n.visibility', 'shared')
      .whereNull('n.binned_at')
      .orderBy(['n.swing_id', 'n.id'])
      .select('n.id', 'n.swing_id', 'u.name as author_name', 'n.body', 'n.time_s', 'n.phase'),
  ]);
  const labels = new Map<number, SummaryLabels>(
    labelRows.map((r) => [Number(r.swing_id), { club: r.club ?? null, strike: r.strike ?? null, flight: r.flight ?? null, rating: r.rating === null ? null : Number(r.rating) }]),
  );
  const notes = noteRows.map((r) => ({
    id: Number(r.id),
    swingId: Number(r.swing_id),
    authorName: r.author_name ?? 'Former coach',
    body: String(r.body),
    timeS: r.time_s === null ? null : Number(r.time_s),
    phase: r.phase ?? null,
  }));
  return { labels, notes };
}
