// Target patterns: expected values with tolerances at swing events, per club group (and optionally per player).
import { EVENT_NAMES } from '@/lib/signal/types';

export const CLUB_GROUPS = ['driver', 'woods-hybrids', 'irons', 'wedges'] as const;
export type ClubGroup = (typeof CLUB_GROUPS)[number];

// Targets check values at the swing events of the signal core (lib/signal/types.ts EVENT_NAMES).
export const TARGET_EVENTS = EVENT_NAMES;
export type TargetEvent = (typeof TARGET_EVENTS)[number];

/** copSide = combined COP x as % of half the stance width, + toward the lead foot (0 = centred, 100 = over the lead foot's centre). */
export const MEASURES = ['leadPct', 'leadHeelPct', 'trailHeelPct', 'copSide'] as const;
export type Measure = (typeof MEASURES)[number];

export interface TargetCheck {
  event: TargetEvent;
  measure: Measure;
  expected: number;
  tolerance: number;
}

export interface Tempo {
  min: number;
  max: number;
}

export interface Target {
  id: number;
  name: string;
  description: string;
  clubGroup: ClubGroup;
  athleteId: number | null;
  ownerUserId: number | null;
  isDefault: boolean;
  commonPractice: boolean;
  checks: TargetCheck[];
  tempo: Tempo | null;
  updatedAt: string;
}

/** Swing label club -> club group. No club label scores as 'irons' (the most common practice club; documented in the API). */
export function clubGroupOf(club: string | null | undefined): ClubGroup {
  if (club === 'driver') return 'driver';
  if (club === 'wood' || club === 'hybrid') return 'woods-hybrids';
  if (club === 'wedge') return 'wedges';
  return 'irons';
}
