// Target patterns: expected values with tolerances at swing events, per club group (and optionally per player).
import type { ClubGroup } from '@/lib/contracts/targets';

// The names, lists and shapes live in the targets contract (lib/contracts/targets.ts).
export { CLUB_GROUPS, MEASURES, TARGET_EVENTS } from '@/lib/contracts/targets';
export type { ClubGroup, Measure, Target, TargetCheck, TargetEvent, Tempo } from '@/lib/contracts/targets';

/** Swing label club -> club group. No club label scores as 'irons' (the most common practice club; documented in the API). */
export function clubGroupOf(club: string | null | undefined): ClubGroup {
  if (club === 'driver') return 'driver';
  if (club === 'wood' || club === 'hybrid') return 'woods-hybrids';
  if (club === 'wedge') return 'wedges';
  return 'irons';
}
