'use client';

import { Button } from '@/components/ui/button';

// Shown when a page fails to render; the server logs the cause, the user sees no internals.
export default function AppError({ reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <div role="alert" className="rounded-lg border border-danger/30 bg-danger-soft p-6">
      <h1 className="text-lg font-semibold text-danger">This page could not be loaded</h1>
      <p className="mt-1 text-sm text-ink">Something went wrong on our side. Try again, or come back in a moment.</p>
      <Button className="mt-4" onClick={reset}>
        Try again
      </Button>
    </div>
  );
}
