// The seeded academy default targets, one per club group. Every number here is common practice (coaching lore
// summarised in the project's domain notes), not a published norm, and deliberately generous: research finds more
// than one successful pressure style (a "front foot" and a "reverse" pattern, Ball & Best 2007), so these are a
// starting point a coach edits, never the only truth.
import type { ClubGroup, TargetCheck, Tempo } from './types';

export interface DefaultTarget {
  clubGroup: ClubGroup;
  name: string;
  description: string;
  checks: TargetCheck[];
  tempo: Tempo | null;
}

const NOTE =
  'Common practice starting point, not the only correct pattern: players succeed with more than one pressure style. Edit it for your player. Coaching information, not a medical assessment; stop and see a physician or physiotherapist if a swing change causes pain.';

// Lead % at impact by club group: irons about 80-90 % on the lead side; the driver stays more behind the ball (common practice).
const IMPACT_LEAD: Record<ClubGroup, { expected: number; tolerance: number }> = {
  driver: { expected: 65, tolerance: 15 },
  'woods-hybrids': { expected: 75, tolerance: 12 },
  irons: { expected: 85, tolerance: 10 },
  wedges: { expected: 85, tolerance: 10 },
};

const LABEL: Record<ClubGroup, string> = { driver: 'Driver', 'woods-hybrids': 'Woods and hybrids', irons: 'Irons', wedges: 'Wedges' };

function checksFor(group: ClubGroup): TargetCheck[] {
  return [
    { event: 'address', measure: 'leadPct', expected: 50, tolerance: 10 }, // near 50/50 at address
    { event: 'top', measure: 'trailHeelPct', expected: 60, tolerance: 20 }, // trail heel loaded at the top
    { event: 'transition', measure: 'leadPct', expected: 55, tolerance: 20 }, // the shift to the lead side has begun
    { event: 'impact', measure: 'leadPct', ...IMPACT_LEAD[group] }, // strong move to the lead side (less with the driver)
    { event: 'finish', measure: 'leadPct', expected: 92, tolerance: 8 }, // nearly all pressure on the lead foot
    { event: 'finish', measure: 'leadHeelPct', expected: 65, tolerance: 20 }, // toward the lead heel
  ];
}

export const DEFAULT_TARGETS: readonly DefaultTarget[] = (['driver', 'woods-hybrids', 'irons', 'wedges'] as const).map((group) => ({
  clubGroup: group,
  name: `${LABEL[group]}: common practice default`,
  description: NOTE,
  checks: checksFor(group),
  tempo: { min: 2.5, max: 3.5 }, // about 3:1 backswing to downswing (Grober & Cholewicki), generous band
}));
