import 'server-only';
import type { Viewer } from '@/lib/auth/viewer';
import { db } from '@/lib/db/client';
import { EVENT_NAMES } from '@/lib/signal';
import type { SwingPatchInput } from '@/lib/contracts/swings';
import { applyEventChanges } from './corrections';
import { applyLabels } from './labels';

/** PATCH /api/swings/:id after the coach check: event moves and resets, then labels, in one transaction. */
export async function patchSwing(viewer: Viewer, swingId: number, input: SwingPatchInput): Promise<void> {
  await db.transaction(async (trx) => {
    const resets = input.resetEvents === 'all' ? [...EVENT_NAMES] : [...new Set(input.resetEvents ?? [])];
    await applyEventChanges(trx, swingId, viewer.id, { moves: input.events ?? {}, resets });
    if (input.labels) await applyLabels(trx, swingId, viewer.id, input.labels);
  });
}
