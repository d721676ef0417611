import type { Metadata } from 'next';
import Link from 'next/link';
import { CoachingCaution } from '@/components/cautions/coaching-caution';
import { UploadWorkbench } from '@/components/recordings/upload-workbench';
import { buttonClass } from '@/components/ui/button';
import { Card, PageHeader } from '@/components/ui/card';
import { requirePageRole } from '@/lib/auth/roles';
import { listAthletesForViewer } from '@/lib/db/athletes';
import { listSessionsForAthlete } from '@/lib/db/practice-sessions';
import { idParamSchema } from '@/lib/http';
import { listProfilesOfCoach } from '@/lib/recordings/profiles';
import { DEFAULT_CUTOFF_HZ } from '@/lib/signal';

export const metadata: Metadata = { title: 'Upload recordings' };

type SearchParams = Promise<Record<string, string | string[] | undefined>>;

const idOf = (v: string | string[] | undefined) => {
  const parsed = idParamSchema.safeParse(typeof v === 'string' ? v : undefined);
  return parsed.success ? parsed.data : null;
};

// /upload?athlete=ID&session=ID: coaches only (students and others are sent to their home page).
export default async function UploadPage({ searchParams }: { searchParams: SearchParams }) {
  const viewer = await requirePageRole('coach');
  const raw = await searchParams;
  const athletes = await listAthletesForViewer(viewer);
  if (athletes.length === 0) {
    return (
      <>
        <PageHeader title="Upload recordings" />
        <Card>
          <p className="text-sm text-ink-muted">Add an athlete to your roster first; recordings always belong to one of your athletes.</p>
          <Link href="/athletes/new" className={`${buttonClass('primary')} mt-4`}>
            Add athlete
          </Link>
        </Card>
      </>
    );
  }
  const wanted = idOf(raw.athlete);
  const athlete = athletes.find((a) => a.id === wanted) ?? athletes[0];
  const [sessions, profiles] = await Promise.all([listSessionsForAthlete(athlete.id), listProfilesOfCoach(viewer)]);
  const sessionId = idOf(raw.session);
  const initialSessionId = sessions.some((s) => s.id === sessionId) ? sessionId : null;
  return (
    <>
      <PageHeader title="Upload recordings" subtitle="Drop a lesson's insole files; each is kept as sent, then read and searched for swings." />
      <div className="space-y-6">
        <CoachingCaution />
        <UploadWorkbench
          key={athlete.id}
          athletes={athletes.map((a) => ({ id: a.id, displayName: a.displayName, handedness: a.handedness, stanceWidthMm: a.stanceWidthMm }))}
          athlete={{ id: athlete.id, displayName: athlete.displayName, handedness: athlete.handedness, stanceWidthMm: athlete.stanceWidthMm }}
          sessions={sessions}
          initialSessionId={initialSessionId}
          profiles={profiles.map((p) => ({ id: p.id, name: p.name }))}
          defaultCutoffHz={DEFAULT_CUTOFF_HZ}
        />
      </div>
    </>
  );
}
