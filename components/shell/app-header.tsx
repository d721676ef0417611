import Link from 'next/link';
import { Wordmark } from '@/components/brand/logo';
import { roleLabels } from '@/components/ui/format';
import type { Viewer } from '@/lib/auth/viewer';
import { getEnv } from '@/lib/env';
import { AppNav } from './app-nav';
import { navItemsByRole } from './nav-items';

export function AppHeader({ viewer }: { viewer: Viewer }) {
  return (
    <header className="border-b border-surface-line bg-surface">
      <div className="mx-auto flex max-w-page items-center justify-between gap-4 px-6 py-3">
        <div className="flex min-w-0 items-center gap-4">
          <Link href="/" aria-label="Stanceline home">
            <Wordmark />
          </Link>
          <AppNav items={navItemsByRole[viewer.role].filter((item) => !item.demoOnly || getEnv().DEMO_MODE === 'true')} />
        </div>
        <div className="flex shrink-0 items-center gap-3 text-sm">
          <span className="text-right leading-tight">
            <span className="block font-medium text-ink" data-testid="viewer-name">{viewer.name}</span>
            <span className="block text-sm text-ink-muted">{roleLabels[viewer.role]}</span>
          </span>
          <Link href="/sign-out" className="rounded-md border border-surface-line px-3 py-1.5 font-medium text-ink hover:bg-surface-sunken">
            Sign out
          </Link>
        </div>
      </div>
    </header>
  );
}
