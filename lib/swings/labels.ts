import 'server-only';
import type { Knex } from 'knex';
import type { SwingLabels } from '@/lib/contracts/swings';
import type { SwingLabelsInput } from '@/lib/contracts/swings';
import { jsonColumn } from '@/lib/db/values';

// A swing's labels (swing_labels) and "not a swing", which is swings.hidden so the session's swing list and any
// stats leave the swing out (GET /api/sessions/:id/recordings reports it as hidden: true); restorable by setting it false.

export const NO_LABELS: Omit<SwingLabels, 'notASwing'> = { club: null, strike: null, flight: null, tags: [], rating: null };

export function labelsOf(row: Record<string, unknown> | undefined, hidden: boolean): SwingLabels {
  if (!row) return { ...NO_LABELS, notASwing: hidden };
  const tags = jsonColumn<string[]>(row.tags) ?? [];
  return {
    club: (row.club as SwingLabels['club']) ?? null,
    strike: (row.strike as SwingLabels['strike']) ?? null,
    flight: (row.flight as SwingLabels['flight']) ?? null,
    tags,
    rating: row.rating === null || row.rating === undefined ? null : Number(row.rating),
    notASwing: hidden,
  };
}

/** Fields left out keep their value. */
export async function applyLabels(trx: Knex.Transaction, swingId: number, userId: number, input: Partial<SwingLabelsInput>): Promise<void> {
  // Concurrent edits of one swing queue on its row. Without this, two requests for a swing with no label row yet
  // both took a gap lock with SELECT ... FOR UPDATE and then both inserted: ER_LOCK_DEADLOCK for one of them.
  await trx('swings').where({ id: swingId }).forUpdate().first('id');
  const { notASwing, ...rest } = input;
  if (notASwing !== undefined) await trx('swings').where({ id: swingId }).update({ hidden: notASwing });
  if (Object.keys(rest).length === 0) return;
  const current = labelsOf(await trx('swing_labels').where({ swing_id: swingId }).forUpdate().first(), false);
  const next = { ...current, ...rest };
  const row = { club: next.club, strike: next.strike, flight: next.flight, tags: JSON.stringify(next.tags), rating: next.rating, updated_by: userId, updated_at: trx.raw('NOW(3)') };
  await trx('swing_labels').insert({ swing_id: swingId, ...row }).onConflict('swing_id').merge();
}
