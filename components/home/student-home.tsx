import { AthleteOverview } from '@/components/athletes/athlete-overview';
import { Card, PageHeader } from '@/components/ui/card';
import type { Viewer } from '@/lib/auth/viewer';
import { listAthletesForViewer } from '@/lib/db/athletes';
import { listSessionsForAthlete } from '@/lib/db/practice-sessions';

export async function StudentHome({ viewer }: { viewer: Viewer }) {
  const [athlete] = await listAthletesForViewer(viewer);
  if (!athlete) {
    return (
      <>
        <PageHeader title={`Hello, ${viewer.name}`} />
        <Card>
          <p className="text-sm text-ink-muted">Your coach has not linked a player profile to your account yet.</p>
        </Card>
      </>
    );
  }
  const sessions = await listSessionsForAthlete(athlete.id);
  return (
    <>
      <PageHeader title={`Hello, ${viewer.name}`} subtitle="Your player profile and sessions" />
      <AthleteOverview athlete={athlete} sessions={sessions} />
    </>
  );
}
