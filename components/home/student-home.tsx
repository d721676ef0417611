import { DrillMailToggle } from '@/components/accounts/drill-mail-toggle';
import { SharedWithMe } from '@/components/accounts/shared-with-me';
import { AthleteOverview } from '@/components/athletes/athlete-overview';
import { getMailPreferences } from '@/lib/accounts/drill-mail';
import { listSharesForStudent } from '@/lib/accounts/shares';
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
  const [sessions, shares, preferences] = await Promise.all([listSessionsForAthlete(athlete.id), listSharesForStudent(viewer), getMailPreferences(viewer)]);
  return (
    <>
      <PageHeader title={`Hello, ${viewer.name}`} subtitle="Your player profile and sessions" />
      <div className="mb-6 grid gap-4 lg:grid-cols-2">
        <Card title="From your coach">
          <SharedWithMe shares={shares} />
        </Card>
        <Card title="Mail from your coach">
          <DrillMailToggle initial={preferences.drillReminders} />
        </Card>
      </div>
      <AthleteOverview athlete={athlete} sessions={sessions} />
    </>
  );
}
