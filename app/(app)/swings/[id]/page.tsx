import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { preload } from 'react-dom';
import { ShareWithStudent } from '@/components/accounts/share-with-student';
import { CoachingCaution } from '@/components/cautions/coaching-caution';
import { MinorConsentNote } from '@/components/cautions/minor-consent-note';
import { ProcessingParameters } from '@/components/swings/processing-parameters';
import { sessionSwingNumbers } from '@/lib/recordings/views';
import type { SwingDetail } from '@/lib/contracts/swings';
import { SwingWorkbench } from '@/components/swings/swing-workbench';
import { Badge } from '@/components/ui/badge';
import { PageHeader } from '@/components/ui/card';
import { contextLabels, formatDate } from '@/components/ui/format';
import { requirePageRole } from '@/lib/auth/roles';
import { getSwingDetail } from '@/lib/db/swings';
import { HttpError, idParamSchema } from '@/lib/http';
import { isMinor } from '@/lib/contracts/athletes';

export const metadata: Metadata = { title: 'Swing' };

// One swing: first paint here on the server (title, athlete, session, cautions, the phase and event tables); the
// traces, editing, labels and notes come from the client viewer through GET /api/swings/:id. Coach of the athlete
// or the student themself; anyone else sees "not found", as for athletes and sessions.
export default async function SwingPage({ params }: { params: Promise<{ id: string }> }) {
  const viewer = await requirePageRole('coach', 'student');
  const id = idParamSchema.safeParse((await params).id);
  if (!id.success) notFound();
  let swing: SwingDetail;
  try {
    swing = (await getSwingDetail(viewer, id.data)).detail; // the numbers only; the traces come through the API
  } catch (error) {
    if (error instanceof HttpError && (error.status === 404 || error.status === 403)) notFound();
    throw error;
  }
  // Start the viewer's GET while the page's scripts load; the client's SWR fetch picks up the preloaded answer.
  preload(`/api/swings/${swing.id}`, { as: 'fetch', crossOrigin: 'anonymous' });
  // The lead (target-side) foot of a right-handed golfer is the left one.
  const handedness = swing.recording.parameters.handedness;
  const leadFoot = handedness === 'right' ? 'left' : handedness === 'left' ? 'right' : null;
  // the number the session's swing table shows (1..N over the whole session in time order), not the file's own
  const number = (await sessionSwingNumbers([swing.session.id])).get(swing.id) ?? swing.index;
  return (
    <>
      <nav aria-label="Breadcrumb" className="mb-2 text-sm text-ink-muted">
        <Link href={`/athletes/${swing.athlete.id}`} className="hover:text-accent hover:underline">
          {swing.athlete.displayName}
        </Link>{' '}
        /{' '}
        <Link href={`/sessions/${swing.session.id}`} className="hover:text-accent hover:underline">
          {formatDate(swing.session.sessionDate)} · {contextLabels[swing.session.context]}
        </Link>{' '}
        / {swing.recording.filename}
      </nav>
      <PageHeader
        title={`Swing ${number}`}
        subtitle={`${swing.recording.filename} (swing ${swing.index} of the file), ${swing.startS.toFixed(3)}–${swing.endS.toFixed(3)} s of the recording${leadFoot ? ` · lead foot ${leadFoot}` : ''}`}
        action={
          <span className="flex gap-2">
            {swing.hidden && <Badge tone="neutral">Marked as not a swing</Badge>}
            {swing.stale && <Badge tone="notice">Kept for its manual corrections; not found by the last processing</Badge>}
            {viewer.role === 'student' && <Badge>Read-only</Badge>}
          </span>
        }
      />
      <div className="space-y-3">
        <CoachingCaution />
        {swing.athlete.dateOfBirth && isMinor(swing.athlete.dateOfBirth) && <MinorConsentNote dateOfBirth={swing.athlete.dateOfBirth} />}
        <SwingWorkbench swingId={swing.id} initial={swing} />
        {/* below the viewer: on a tablet the traces come first (issue 12), sharing is an after-the-lesson step */}
        {viewer.role === 'coach' && <ShareWithStudent target={{ swingId: swing.id }} athleteId={swing.athlete.id} athleteName={swing.athlete.displayName} />}
        {viewer.role === 'coach' && (
          <details className="rounded-lg border border-surface-line bg-surface" data-testid="processing-details">
            <summary className="flex min-h-11 cursor-pointer items-center px-4 text-sm font-medium text-ink">Processing details</summary>
            <div className="px-4 pb-4">
              <ProcessingParameters parameters={swing.recording.parameters} algorithmVersion={swing.recording.algorithmVersion} />
            </div>
          </details>
        )}
      </div>
    </>
  );
}
