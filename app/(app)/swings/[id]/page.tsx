import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { CoachingCaution } from '@/components/cautions/coaching-caution';
import { MinorConsentNote } from '@/components/cautions/minor-consent-note';
import { formatTempo, impactSourceLabels } from '@/components/recordings/format';
import { EventTable } from '@/components/swings/event-table';
import { PhaseTable } from '@/components/swings/phase-table';
import { ProcessingParameters } from '@/components/swings/processing-parameters';
import type { SwingDetail } from '@/components/swings/swing-schemas';
import { Badge } from '@/components/ui/badge';
import { Card, PageHeader } from '@/components/ui/card';
import { contextLabels, formatDate } from '@/components/ui/format';
import { requirePageRole } from '@/lib/auth/roles';
import { getSwingForViewer } from '@/lib/db/swings';
import { HttpError, idParamSchema } from '@/lib/http';
import { isMinor } from '@/lib/validations/athlete';

export const metadata: Metadata = { title: 'Swing' };

function Fact({ label, value, testId }: { label: string; value: string; testId?: string }) {
  return (
    <div className="rounded-lg border border-surface-line bg-surface p-4">
      <p className="text-xs font-medium uppercase tracking-wide text-ink-muted">{label}</p>
      <p className="mt-1 text-lg font-semibold tabular-nums text-ink" data-testid={testId}>
        {value}
      </p>
    </div>
  );
}

// One swing's phase table (the trace viewer comes later). Coach of the athlete or the student themself;
// anyone else sees "not found", as for athletes and sessions.
export default async function SwingPage({ params }: { params: Promise<{ id: string }> }) {
  const viewer = await requirePageRole('coach', 'student');
  const id = idParamSchema.safeParse((await params).id);
  if (!id.success) notFound();
  let swing: SwingDetail;
  try {
    swing = await getSwingForViewer(viewer, id.data);
  } catch (error) {
    if (error instanceof HttpError && (error.status === 404 || error.status === 403)) notFound();
    throw error;
  }
  const leadAtImpact = swing.events.find((e) => e.name === 'impact')?.leadPct;
  // The lead (target-side) foot of a right-handed golfer is the left one.
  const handedness = swing.recording.parameters.handedness;
  const leadFoot = handedness === 'right' ? 'left' : handedness === 'left' ? 'right' : null;
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
        title={`Swing ${swing.index}`}
        subtitle={`${swing.recording.filename}, ${swing.startS.toFixed(3)}–${swing.endS.toFixed(3)} s on the recording's time axis`}
        action={swing.stale ? <Badge tone="notice">Kept for its manual corrections; not found by the last processing</Badge> : undefined}
      />
      <div className="space-y-6">
        <CoachingCaution />
        {swing.athlete.dateOfBirth && isMinor(swing.athlete.dateOfBirth) && <MinorConsentNote dateOfBirth={swing.athlete.dateOfBirth} />}
        <div className="grid gap-4 sm:grid-cols-3">
          <Fact label="Tempo (backswing : downswing)" value={formatTempo(swing.tempoRatio)} testId="swing-tempo" />
          <Fact label="Lead % at impact" value={leadAtImpact === null || leadAtImpact === undefined ? '—' : `${leadAtImpact.toFixed(1)} %`} />
          <Fact label="Impact time from" value={impactSourceLabels[swing.impactSource]} testId="swing-impact-source" />
        </div>
        <Card title="Phases">
          <PhaseTable phases={swing.phases} />
          <p className="mt-3 text-xs text-ink-muted">
            COP = centre of pressure of both feet in the stance frame; path is its travelled length, speed its fastest
            movement. Lead % is the share of the total load on the lead (target-side) foot
            {leadFoot ? `, here the ${leadFoot} foot (${handedness}-handed)` : ''}. Tempo = (top − address) /
            (impact − top).
          </p>
        </Card>
        <Card title="Values at the events">
          <EventTable events={swing.events} />
        </Card>
        <Card title="Processing">
          <ProcessingParameters parameters={swing.recording.parameters} algorithmVersion={swing.recording.algorithmVersion} />
        </Card>
      </div>
    </>
  );
}
