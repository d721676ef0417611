import type { ReactNode } from 'react';
import { Wordmark } from '@/components/brand/logo';

export default function AuthLayout({ children }: { children: ReactNode }) {
  return (
    <main className="flex min-h-screen items-center justify-center px-6 py-12">
      <div className="w-full max-w-sm">
        <div className="mb-8 flex justify-center">
          <Wordmark size={36} />
        </div>
        <div className="rounded-lg border border-surface-line bg-surface p-6 shadow-sm">{children}</div>
        <p className="mt-6 text-center text-sm text-ink-faint">Ground-pressure workbench for golf coaching</p>
      </div>
    </main>
  );
}
