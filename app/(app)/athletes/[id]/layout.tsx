import type { ReactNode } from 'react';
import { notFound } from 'next/navigation';
import { requirePageRole } from '@/lib/auth/roles';
import { findAthleteForViewer } from '@/lib/db/athletes';
import { idParamSchema } from '@/lib/http';

// Scope check outside the Suspense boundary of loading.tsx: an athlete outside the viewer's roster answers with a
// real 404 status instead of a streamed "not found" inside a 200 page.
export default async function AthleteLayout({ children, params }: { children: ReactNode; params: Promise<{ id: string }> }) {
  const viewer = await requirePageRole('coach', 'student');
  const id = idParamSchema.safeParse((await params).id);
  if (!id.success || !(await findAthleteForViewer(viewer, id.data))) notFound();
  return children;
}
