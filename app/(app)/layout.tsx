import type { ReactNode } from 'react';
import { AppHeader } from '@/components/shell/app-header';
import { requirePageRole } from '@/lib/auth/roles';

export const dynamic = 'force-dynamic';

export default async function AppLayout({ children }: { children: ReactNode }) {
  const viewer = await requirePageRole();
  return (
    <div className="min-h-screen">
      <AppHeader viewer={viewer} />
      <main className="mx-auto max-w-page px-6 py-8">{children}</main>
    </div>
  );
}
