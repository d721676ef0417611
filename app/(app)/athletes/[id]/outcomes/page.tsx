import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { CoachingCaution } from '@/components/cautions/coaching-caution';
import { MinorConsentNote } from '@/components/cautions/minor-consent-note';
import { OutcomesView } from '@/components/shots/outcomes-view';
import { PageHeader } from '@/components/ui/card';
import { requirePageRole } from '@/lib/auth/roles';
import { isMinor } from '@/lib/contracts/athletes';
import { findAthleteForViewer } from '@/lib/db/athletes';
import { idParamSchema } from '@/lib/http';
import { shotUnitsOf } from '@/lib/shots/units-preference';

export const metadata: Metadata = { title: 'Shots and pressure' };

// For one player: which pressure measures went with ball speed, carry and the other shot results (paired shots).
export default async function OutcomesPage({ params }: { params: Promise<{ id: string }> }) {
  const viewer = await requirePageRole('coach', 'student');
  const id = idParamSchema.safeParse((await params).id);
  if (!id.success) notFound();
  const athlete = await findAthleteForViewer(viewer, id.data);
  if (!athlete) notFound();
  return (
    <>
      <nav aria-label="Breadcrumb" className="mb-2 text-sm text-ink-muted">
        <Link href={`/athletes/${athlete.id}`} className="hover:text-accent hover:underline">
          {athlete.displayName}
        </Link>{' '}
        / Shots and pressure
      </nav>
      <PageHeader title="Shots and pressure" subtitle={`${athlete.displayName}: which pressure measures went with the results of the shots paired with swings.`} />
      <div className="space-y-4">
        <CoachingCaution />
        {athlete.dateOfBirth && isMinor(athlete.dateOfBirth) && <MinorConsentNote dateOfBirth={athlete.dateOfBirth} />}
        <OutcomesView athleteId={athlete.id} units={await shotUnitsOf(viewer)} />
      </div>
    </>
  );
}
