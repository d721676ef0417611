import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { AthleteForm } from '@/components/athletes/athlete-form';
import { CoachingCaution } from '@/components/cautions/coaching-caution';
import { Card, PageHeader } from '@/components/ui/card';
import { requirePageRole } from '@/lib/auth/roles';
import { findAthleteForViewer } from '@/lib/db/athletes';
import { idParamSchema } from '@/lib/http';

export const metadata: Metadata = { title: 'Edit athlete' };

export default async function EditAthletePage({ params }: { params: Promise<{ id: string }> }) {
  const viewer = await requirePageRole('coach');
  const id = idParamSchema.safeParse((await params).id);
  if (!id.success) notFound();
  const athlete = await findAthleteForViewer(viewer, id.data);
  if (!athlete) notFound();
  return (
    <>
      <PageHeader title={`Edit ${athlete.displayName}`} />
      <div className="space-y-6">
        <CoachingCaution />
        <Card className="max-w-2xl">
          <AthleteForm
            athleteId={athlete.id}
            initial={{
              displayName: athlete.displayName,
              handedness: athlete.handedness,
              stanceWidthMm: athlete.stanceWidthMm,
              dateOfBirth: athlete.dateOfBirth,
              homeClub: athlete.homeClub,
            }}
          />
        </Card>
      </div>
    </>
  );
}
