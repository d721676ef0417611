import type { Measure, TargetEvent } from '@/lib/targets/types';

export interface Drill {
  id: number;
  name: string;
  steps: string[];
  addressesChecks: { event: TargetEvent; measure: Measure }[];
  cautions: string;
  ownerUserId: number;
}

export interface DrillAssignment {
  id: number;
  drill: Drill;
  athleteId: number;
  athleteName: string;
  assignedBy: number | null;
  assignedAt: string;
  dueDate: string;
  practiceDone: boolean;
  doneAt: string | null;
  studentNote: string | null;
}

/** The caution every drill is shown with, besides its own (coaching information; pain; medical advice; minors). */
export const DRILL_CAUTION =
  'Coaching information, not a medical assessment. Stop if a drill causes pain and see a physician or physiotherapist; follow their advice over this drill. Players under 18 practise with a parent or guardian’s consent.';
