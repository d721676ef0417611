// Drill and assignment shapes live in the drills contract (lib/contracts/drills.ts).
export type { Drill, DrillAssignment } from '@/lib/contracts/drills';

/** The caution every drill is shown with, besides its own (coaching information; pain; medical advice; minors). */
export const DRILL_CAUTION =
  'Coaching information, not a medical assessment. Stop if a drill causes pain and see a physician or physiotherapist; follow their advice over this drill. Players under 18 practise with a parent or guardian’s consent.';
