import type { Metadata } from 'next';
import { CoachingCaution } from '@/components/cautions/coaching-caution';
import { CoachAssignments, DrillLibrary } from '@/components/drills/drill-library';
import { DrillForm } from '@/components/drills/drill-form';
import { StudentDrills } from '@/components/drills/student-drills';
import { Card, PageHeader } from '@/components/ui/card';
import { requirePageRole } from '@/lib/auth/roles';
import { listAthletesForViewer } from '@/lib/db/athletes';

export const metadata: Metadata = { title: 'Drills' };

// Coach: the drill library, assigning, and what was practised. Student: the drills given to them.
export default async function DrillsPage() {
  const viewer = await requirePageRole('coach', 'student');
  if (viewer.role === 'student') {
    return (
      <>
        <PageHeader title="My drills" subtitle="What your coach has given you to practise. Mark each one done when you have practised it." />
        <div className="space-y-4">
          <CoachingCaution />
          <StudentDrills />
        </div>
      </>
    );
  }
  const athletes = (await listAthletesForViewer(viewer)).map((a) => ({ id: a.id, displayName: a.displayName }));
  return (
    <>
      <PageHeader title="Drills" subtitle="Your drill library: assign a drill to a player with a due date." />
      <div className="space-y-6">
        <CoachingCaution />
        <Card title="Library">
          <DrillLibrary athletes={athletes} />
        </Card>
        <Card title="Assigned">
          <CoachAssignments athletes={athletes} />
        </Card>
        <Card title="Add a drill">
          <DrillForm />
        </Card>
      </div>
    </>
  );
}
