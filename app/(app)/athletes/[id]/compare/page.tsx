import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { CoachingCaution } from '@/components/cautions/coaching-caution';
import { CompareView } from '@/components/compare/compare-view';
import { PageHeader } from '@/components/ui/card';
import { requirePageRole } from '@/lib/auth/roles';
import { findAthleteForViewer } from '@/lib/db/athletes';
import { setsWithSwings } from '@/lib/compare/service';
import { idParamSchema } from '@/lib/http';

export const metadata: Metadata = { title: 'Compare sets' };

export default async function ComparePage({ params }: { params: Promise<{ id: string }> }) {
  const viewer = await requirePageRole('coach', 'student');
  const id = idParamSchema.safeParse((await params).id);
  if (!id.success) notFound();
  const athlete = await findAthleteForViewer(viewer, id.data);
  if (!athlete) notFound();
  // only sets that hold swings: contexts, and months newest first
  const { contexts, months } = await setsWithSwings(athlete.id);
  return (
    <>
      <nav aria-label="Breadcrumb" className="mb-2 text-sm text-ink-muted">
        <Link href={`/athletes/${athlete.id}`} className="hover:text-accent hover:underline">{athlete.displayName}</Link> / Compare
      </nav>
      <PageHeader title="Compare two sets of swings" subtitle={`${athlete.displayName}: practice against on course, or one month against another.`} />
      <div className="space-y-4">
        <CoachingCaution />
        <CompareView athleteId={athlete.id} contexts={contexts} months={months} />
      </div>
    </>
  );
}
