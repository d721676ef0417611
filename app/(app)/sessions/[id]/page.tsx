import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { MinorConsentNote } from '@/components/cautions/minor-consent-note';
import { CoachingCaution } from '@/components/cautions/coaching-caution';
import { DrillReport } from '@/components/drills/drill-report';
import { Card, PageHeader } from '@/components/ui/card';
import { SessionRecordingsPanel } from '@/components/recordings/session-recordings-panel';
import { Badge } from '@/components/ui/badge';
import { buttonClass } from '@/components/ui/button';
import { contextLabels, formatDate } from '@/components/ui/format';
import { requirePageRole } from '@/lib/auth/roles';
import { findAthleteForViewer } from '@/lib/db/athletes';
import { findSession } from '@/lib/db/practice-sessions';
import { SessionActions } from '@/components/sessions/session-actions';
import { idParamSchema } from '@/lib/http';
import { getSessionRecordingsView } from '@/lib/recordings/views';
import { isMinor } from '@/lib/contracts/athletes';
import { ShotPairingPanel } from '@/components/shots/shot-pairing-panel';
import { db } from '@/lib/db/client';
import { sessionShotsView } from '@/lib/shots/session-shots';
import { shotUnitsOf } from '@/lib/shots/units-preference';

export const metadata: Metadata = { title: 'Session' };

// A practice session: its recordings with their state and the swings found. The athlete's coach (who can upload
// more) and the student whose session it is (read-only); anyone else gets "not found".
export default async function SessionPage({ params }: { params: Promise<{ id: string }> }) {
  const viewer = await requirePageRole('coach', 'student');
  const id = idParamSchema.safeParse((await params).id);
  if (!id.success) notFound();
  const view = await getSessionRecordingsView(id.data);
  if (!view) notFound();
  const athlete = await findAthleteForViewer(viewer, view.session.athleteId);
  if (!athlete) notFound();
  const session = await findSession(view.session.id);
  if (!session) notFound();
  const context = session.context;
  const shots = await sessionShotsView(db, view.session.id, await shotUnitsOf(viewer));
  return (
    <>
      <nav aria-label="Breadcrumb" className="mb-2 text-sm text-ink-muted">
        <Link href={`/athletes/${athlete.id}`} className="hover:text-accent hover:underline">
          {athlete.displayName}
        </Link>{' '}
        / Session
      </nav>
      <PageHeader
        title={`${formatDate(view.session.sessionDate)} · ${contextLabels[context] ?? view.session.context}`}
        subtitle={[view.session.location, session.notes].filter(Boolean).join(' · ') || undefined}
        action={
          <span className="flex items-center gap-2">
            <Link href={`/sessions/${view.session.id}/summary`} className={buttonClass('secondary')} data-testid="lesson-summary-link">
              Lesson summary
            </Link>
            {viewer.role === 'coach' ? (
              <Link href={`/upload?athlete=${athlete.id}&session=${view.session.id}`} className={buttonClass('primary')}>
                Upload recordings
              </Link>
            ) : (
              <Badge>Read-only</Badge>
            )}
          </span>
        }
      />
      <div className="space-y-6">
        {viewer.role === 'coach' && <SessionActions session={session} recordingCount={view.recordings.length} />}
        <CoachingCaution />
        {athlete.dateOfBirth && isMinor(athlete.dateOfBirth) && <MinorConsentNote dateOfBirth={athlete.dateOfBirth} />}
        <SessionRecordingsPanel sessionId={view.session.id} initial={view} canEdit={viewer.role === 'coach'} />
        <ShotPairingPanel sessionId={view.session.id} initial={shots} canEdit={viewer.role === 'coach'} />
        <Card title="Drills before this session">
          <DrillReport sessionId={view.session.id} />
        </Card>
      </div>
    </>
  );
}
