import type { Metadata } from 'next';
import { CoachingCaution } from '@/components/cautions/coaching-caution';
import { StartLiveForm } from '@/components/live/start-live-form';
import { Card, PageHeader } from '@/components/ui/card';
import { requirePageRole } from '@/lib/auth/roles';
import { listAthletesForViewer } from '@/lib/db/athletes';

export const metadata: Metadata = { title: 'Live lesson' };

// /live: a coach picks the student, the session context and the drill in focus, then opens the live screen.
export default async function LiveStartPage() {
  const viewer = await requirePageRole('coach');
  const athletes = await listAthletesForViewer(viewer);
  return (
    <>
      <PageHeader title="Live lesson" subtitle="Each swing's weight shift on the screen right after the finish, while the student is still on the mat." />
      <div className="space-y-6">
        <CoachingCaution />
        <Card title="Start">
          {athletes.length === 0 ? (
            <p className="text-sm text-ink-muted">Add a student to your roster first.</p>
          ) : (
            <StartLiveForm athletes={athletes.map((a) => ({ id: a.id, displayName: a.displayName }))} />
          )}
        </Card>
      </div>
    </>
  );
}
