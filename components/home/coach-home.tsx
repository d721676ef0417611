import Link from 'next/link';
import { AthleteTable } from '@/components/athletes/athlete-table';
import { buttonClass } from '@/components/ui/button';
import { Card, PageHeader } from '@/components/ui/card';
import type { Viewer } from '@/lib/auth/viewer';
import { countSessionsSince, listAthletesForViewer } from '@/lib/db/athletes';
import { formatDate } from '@/components/ui/format';

function Stat({ label, value }: { label: string; value: string | number }) {
  return (
    <div className="rounded-lg border border-surface-line bg-surface p-4">
      <p className="text-sm font-medium uppercase tracking-wide text-ink-muted">{label}</p>
      <p className="mt-1 text-2xl font-semibold tabular-nums text-ink">{value}</p>
    </div>
  );
}

export async function CoachHome({ viewer }: { viewer: Viewer }) {
  const athletes = await listAthletesForViewer(viewer);
  const since = new Date(Date.now() - 90 * 86_400_000).toISOString().slice(0, 10);
  const recentSessions = await countSessionsSince(viewer, since);
  const latest = athletes.reduce<string | null>((max, a) => (a.lastSession && (!max || a.lastSession.date > max) ? a.lastSession.date : max), null);
  const withoutSessions = athletes.filter((a) => a.lastSession === null).length;
  const recent = [...athletes]
    .sort((a, b) => (b.lastSession?.date ?? '').localeCompare(a.lastSession?.date ?? ''))
    .slice(0, 5);
  return (
    <>
      <PageHeader title={`Welcome, ${viewer.name}`} subtitle="Roster summary" />
      <div className="mb-6 grid gap-4 sm:grid-cols-4">
        <Stat label="Athletes on roster" value={athletes.length} />
        <Stat label="Latest session" value={formatDate(latest)} />
        <Stat label="Sessions, last 90 days" value={recentSessions} />
        <Stat label="Athletes without sessions" value={withoutSessions} />
      </div>
      <Card
        title="Most recently seen"
        action={
          <Link href="/roster" className={buttonClass('secondary')}>
            Open roster
          </Link>
        }
      >
        <AthleteTable athletes={recent} />
      </Card>
    </>
  );
}
