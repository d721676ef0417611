import type { Metadata } from 'next';
import { CoachingCaution } from '@/components/cautions/coaching-caution';
import { TargetList } from '@/components/targets/target-list';
import { PageHeader } from '@/components/ui/card';
import { requirePageRole } from '@/lib/auth/roles';
import { listAthletesForViewer } from '@/lib/db/athletes';

export const metadata: Metadata = { title: 'Targets' };

// Target patterns per club group. The coach edits; the student reads the ones that apply to them.
export default async function TargetsPage() {
  const viewer = await requirePageRole('coach', 'student');
  const athletes = (await listAthletesForViewer(viewer)).map((a) => ({ id: a.id, displayName: a.displayName }));
  return (
    <>
      <PageHeader title="Targets" subtitle="Expected pressure at each swing event, per club group and optionally per player." />
      <div className="space-y-4">
        <CoachingCaution />
        <p role="note" className="rounded-md border border-band/40 bg-band-soft px-4 py-3 text-sm text-ink">
          The defaults are <span className="font-semibold">common practice</span>, not a norm: studies of skilled players find more than one
          successful way to move pressure (some stay more on the back foot through impact). Treat a target as a starting point for this
          player and change it when their own good swings say otherwise.
        </p>
        <TargetList athletes={athletes} canEdit={viewer.role === 'coach'} />
      </div>
    </>
  );
}
