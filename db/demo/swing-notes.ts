// The demo coach's work on Ada Fenwick's demo swings (invented): a few labels and notes shared with her, and
// one coach-only note. No event corrections: the demo shows the automatic events. Runs after the demo recordings
// are processed; swings are found by recording id and swing index, so the rows are the same on every run.
import type { Knex } from 'knex';

const COACH_USER_ID = 2; // coach@ (Maren Solberg), Ada's coach in scenario.ts

export const DEMO_SWING_LABELS = [
  { recordingId: 1, swingIndex: 1, club: 'iron-7', strike: 'solid', flight: 'draw', tags: ['baseline'], rating: 4 },
  { recordingId: 1, swingIndex: 2, club: 'iron-7', strike: 'fat', flight: 'pull', tags: ['baseline', 'early lead heel'], rating: 2 },
  { recordingId: 2, swingIndex: 1, club: 'driver', strike: 'thin', flight: 'fade', tags: [], rating: 3 },
] as const;

export const DEMO_SWING_NOTES = [
  {
    recordingId: 1,
    swingIndex: 1,
    phase: 'downswing',
    timeS: null,
    visibility: 'shared',
    body: 'Good: the pressure moves to the lead side before impact here. This is the feel to keep.',
  },
  {
    recordingId: 1,
    swingIndex: 2,
    phase: null,
    timeS: 'top',
    visibility: 'shared',
    body: 'At the top most of your weight is already on the lead heel. Try the slow step drill at half speed; stop if your back or neck hurts.',
  },
  {
    recordingId: 1,
    swingIndex: 2,
    phase: 'transition',
    timeS: null,
    visibility: 'coach',
    body: 'Compare with block 2 next lesson before changing the set-up.',
  },
] as const;

async function swingAt(knex: Knex, recordingId: number, swingIndex: number): Promise<{ id: number; top: number } | null> {
  const swing = await knex('swings').where({ recording_id: recordingId, swing_index: swingIndex, stale: false }).first('id');
  if (!swing) return null;
  const top = await knex('swing_events').where({ swing_id: swing.id, name: 'top' }).first('time_s');
  return { id: Number(swing.id), top: Number(top?.time_s ?? 0) };
}

/** Writes the demo labels and notes; existing ones on those swings are replaced. */
export async function seedDemoSwingNotes(knex: Knex): Promise<void> {
  await knex.transaction(async (trx) => {
    for (const l of DEMO_SWING_LABELS) {
      const swing = await swingAt(trx, l.recordingId, l.swingIndex);
      if (!swing) continue;
      await trx('swing_labels').where({ swing_id: swing.id }).delete();
      await trx('swing_labels').insert({ swing_id: swing.id, club: l.club, strike: l.strike, flight: l.flight, tags: JSON.stringify(l.tags), rating: l.rating, updated_by: COACH_USER_ID });
    }
    const done = new Set<number>();
    for (const n of DEMO_SWING_NOTES) {
      const swing = await swingAt(trx, n.recordingId, n.swingIndex);
      if (!swing) continue;
      if (!done.has(swing.id)) await trx('swing_annotations').where({ swing_id: swing.id }).delete();
      done.add(swing.id);
      // a note pinned to "top" sits at the swing's (automatic) top time
      await trx('swing_annotations').insert({ swing_id: swing.id, author_user_id: COACH_USER_ID, body: n.body, phase: n.phase, time_s: n.timeS === 'top' ? swing.top : null, visibility: n.visibility });
    }
  });
}
