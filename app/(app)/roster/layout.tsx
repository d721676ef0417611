import type { ReactNode } from 'react';
import { requirePageRole } from '@/lib/auth/roles';

// The role check runs here, outside the Suspense boundary of loading.tsx, so a wrong role gets a real HTTP
// redirect before any of the page streams.
export default async function RosterLayout({ children }: { children: ReactNode }) {
  await requirePageRole('coach');
  return children;
}
