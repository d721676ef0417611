import { AthleteProfile } from '@/components/athletes/athlete-profile';
import { SessionList } from '@/components/athletes/session-list';
import { CoachingCaution } from '@/components/cautions/coaching-caution';
import { Card } from '@/components/ui/card';
import type { AthleteSummary, PracticeSession } from '@/lib/contracts/athletes';

/** The caution, the player's profile and their sessions: the body of the athlete page and of the student's home. */
export function AthleteOverview({ athlete, sessions }: { athlete: AthleteSummary; sessions: PracticeSession[] }) {
  return (
    <div className="space-y-6">
      <CoachingCaution />
      <Card title="Profile">
        <AthleteProfile athlete={athlete} />
      </Card>
      <Card title={`Sessions (${sessions.length})`}>
        <SessionList sessions={sessions} />
      </Card>
    </div>
  );
}
