import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { CoachingCaution } from '@/components/cautions/coaching-caution';
import { LiveScreen } from '@/components/live/live-screen';
import { requirePageRole } from '@/lib/auth/roles';
import { HttpError, idParamSchema } from '@/lib/http';
import { requireLive } from '@/lib/live/session';
import { liveView } from '@/lib/live/view';

export const metadata: Metadata = { title: 'Live lesson' };

// /live/:id: the live screen, made for a tablet on the range (large type, one-tap labels).
export default async function LivePage({ params }: { params: Promise<{ id: string }> }) {
  const viewer = await requirePageRole('coach');
  const id = idParamSchema.safeParse((await params).id);
  if (!id.success) notFound();
  const row = await requireLive(viewer, id.data, 'read').catch((error: unknown) => {
    if (error instanceof HttpError) notFound();
    throw error;
  });
  const view = await liveView(viewer, row);
  return (
    <div className="space-y-4">
      <CoachingCaution />
      <LiveScreen initial={view} />
    </div>
  );
}
