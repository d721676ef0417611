import { describe, expect, it } from 'vitest';
import { checkMoves } from '@/lib/drills/report';
import type { SwingFacts } from '@/lib/targets/swing-facts';

// The drill report's before/after means, against a small hand-worked example (arithmetic means by hand).
const swing = (id: number, sessionDate: string, impactLead: number | null, hidden = false): SwingFacts => ({
  id,
  athleteId: 1,
  sessionId: id,
  sessionDate,
  context: 'practice',
  hidden,
  partial: false,
  club: null,
  clubGroup: 'irons',
  tempoRatio: 3,
  stanceWidthMm: 380,
  values: { impact: { leadPct: impactLead } },
  phases: {},
});

describe('checkMoves', () => {
  it('means before the assignment date and in this one session; moved = after - before', () => {
    // session 10 on 2026-02-17 holds swings 4, 5 (hidden) and 7; swing 3 is an earlier session after the assignment
    const swings = [swing(1, '2026-02-01', 60), swing(2, '2026-02-05', 70), swing(3, '2026-02-12', 80), { ...swing(4, '2026-02-17', 86), sessionId: 10 }, { ...swing(5, '2026-02-17', 99, true), sessionId: 10 }, { ...swing(7, '2026-02-17', 90), sessionId: 10 }, swing(6, '2026-03-01', 10)];
    const [m] = checkMoves([{ event: 'impact', measure: 'leadPct' }], swings, '2026-02-11', 10);
    expect(m.before).toEqual({ mean: 65, n: 2 }); // (60 + 70) / 2 by hand
    expect(m.after).toEqual({ mean: 88, n: 2 }); // (86 + 90) / 2; the hidden swing, the earlier and the later session left out
    expect(m.moved).toBe(23);
  });

  it('no swings on one side: no move', () => {
    const [m] = checkMoves([{ event: 'impact', measure: 'leadPct' }], [swing(1, '2026-02-20', 80)], '2026-02-11', 1);
    expect(m.before).toBeNull();
    expect(m.moved).toBeNull();
  });
});
