import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { CoachingCaution } from '@/components/cautions/coaching-caution';
import { ProgressView } from '@/components/progress/progress-view';
import { PageHeader } from '@/components/ui/card';
import { requirePageRole } from '@/lib/auth/roles';
import { findAthleteForViewer } from '@/lib/db/athletes';
import { idParamSchema } from '@/lib/http';

export const metadata: Metadata = { title: 'Progress' };

export default async function ProgressPage({ params }: { params: Promise<{ id: string }> }) {
  const viewer = await requirePageRole('coach', 'student');
  const id = idParamSchema.safeParse((await params).id);
  if (!id.success) notFound();
  const athlete = await findAthleteForViewer(viewer, id.data);
  if (!athlete) notFound();
  return (
    <>
      <nav aria-label="Breadcrumb" className="mb-2 text-sm text-ink-muted">
        <Link href={`/athletes/${athlete.id}`} className="hover:text-accent hover:underline">{athlete.displayName}</Link> / Progress
      </nav>
      <PageHeader title="Progress across sessions" subtitle={`${athlete.displayName}: session means of chosen measures and of the target checks passed.`} />
      <div className="space-y-4">
        <CoachingCaution />
        <ProgressView athleteId={athlete.id} />
      </div>
    </>
  );
}
