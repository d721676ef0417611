import { describe, expect, it } from 'vitest';
import { compareSets } from '@/lib/compare/compare';
import { progressBySession } from '@/lib/compare/progress';
import type { SwingFacts } from '@/lib/targets/swing-facts';

// Partial swings (pitches, half swings) are left out of compare and progress by default (issue "Every swing");
// the means are worked by hand.
const swing = (id: number, context: string, tempo: number, partial: boolean): SwingFacts => ({
  id,
  athleteId: 1,
  sessionId: context === 'lesson' ? 1 : 2,
  sessionDate: context === 'lesson' ? '2026-02-01' : '2026-02-08',
  context,
  hidden: false,
  partial,
  club: null,
  clubGroup: 'irons',
  tempoRatio: tempo,
  stanceWidthMm: 400,
  values: {},
  phases: {},
});

const swings = [swing(1, 'lesson', 3, false), swing(2, 'lesson', 2, true), swing(3, 'practice', 4, false)];

describe('partial swings in compare and progress', () => {
  it('compare leaves them out unless asked for', () => {
    expect(compareSets(swings, 'context:lesson', 'context:practice', ['tempoRatio']).a.values.tempoRatio).toEqual([3]);
    expect(compareSets(swings, 'context:lesson', 'context:practice', ['tempoRatio'], { includePartial: true }).a.values.tempoRatio).toEqual([3, 2]);
  });
  it('progress leaves them out unless asked for', () => {
    const sessions = [{ id: 1, date: '2026-02-01', context: 'lesson' }];
    expect(progressBySession(sessions, swings, ['tempoRatio'], () => null)[0].metrics.tempoRatio).toMatchObject({ mean: 3, n: 1 });
    expect(progressBySession(sessions, swings, ['tempoRatio'], () => null, { includePartial: true })[0].metrics.tempoRatio).toMatchObject({ mean: 2.5, n: 2 }); // (3 + 2) / 2
  });
});
