import type { Metadata } from 'next';
import { AdminHome } from '@/components/home/admin-home';
import { CoachHome } from '@/components/home/coach-home';
import { ResearcherHome } from '@/components/home/researcher-home';
import { StudentHome } from '@/components/home/student-home';
import { requirePageRole } from '@/lib/auth/roles';

export const metadata: Metadata = { title: 'Overview' };

// One home page per role.
export default async function HomePage() {
  const viewer = await requirePageRole();
  switch (viewer.role) {
    case 'coach':
      return <CoachHome viewer={viewer} />;
    case 'student':
      return <StudentHome viewer={viewer} />;
    case 'admin':
      return <AdminHome viewer={viewer} />;
    case 'researcher':
      return <ResearcherHome />;
  }
}
