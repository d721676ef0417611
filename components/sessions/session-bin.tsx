'use client';
// The player's deleted sessions, restorable for 30 days (coach only). The one just deleted comes first, with its
// undo line at the top of the page.
import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import useSWR from 'swr';
import { z } from 'zod';
import { Button } from '@/components/ui/button';
import { contextLabels, formatDate } from '@/components/ui/format';
import { ApiError, fetchJson, sendJson } from '@/lib/fetcher';
import { BIN_DAYS, sessionResponseSchema } from '@/lib/contracts/sessions';

const binSchema = z.object({ sessions: z.array(sessionResponseSchema) });

export function SessionBin({ athleteId, justBinned }: { athleteId: number; justBinned: number | null }) {
  const router = useRouter();
  const url = `/api/athletes/${athleteId}/sessions/bin`;
  const { data, mutate } = useSWR(url, fetchJson(binSchema));
  const [error, setError] = useState<string | null>(null);
  const [restored, setRestored] = useState<number | null>(null);
  const sessions = data?.sessions ?? [];

  async function restore(id: number) {
    setError(null);
    try {
      await sendJson(`/api/sessions/${id}/restore`, 'POST', undefined, sessionResponseSchema);
      setRestored(id);
      await mutate();
      router.refresh();
    } catch (e) {
      setError(e instanceof ApiError ? e.message : 'Could not restore the session.');
    }
  }

  const just = sessions.find((s) => s.id === justBinned);
  return (
    <div className="space-y-3" data-testid="session-bin">
      {just && (
        <div role="status" className="flex flex-wrap items-center gap-3 rounded-md border border-surface-line bg-surface-sunken p-3 text-sm">
          <span>
            Session of {formatDate(just.sessionDate)} moved to the bin.
          </span>
          <Button type="button" variant="secondary" className="min-h-11" onClick={() => void restore(just.id)} data-testid="undo-delete">
            Undo
          </Button>
        </div>
      )}
      {restored !== null && (
        <p role="status" className="text-sm text-ink">
          Session restored.{' '}
          <Link href={`/sessions/${restored}`} className="text-accent underline">
            Open it
          </Link>
        </p>
      )}
      {sessions.length > 0 && (
        <details className="rounded-md border border-surface-line p-3">
          <summary className="cursor-pointer text-sm font-medium text-ink">Bin ({sessions.length}) · deleted sessions are kept {BIN_DAYS} days</summary>
          <ul className="mt-2 divide-y divide-surface-line">
            {sessions.map((s) => (
              <li key={s.id} className="flex flex-wrap items-center gap-3 py-2 text-sm" data-testid="binned-session">
                <span className="tabular-nums">{formatDate(s.sessionDate)}</span>
                <span>{contextLabels[s.context]}</span>
                {s.location && <span className="text-ink-muted">{s.location}</span>}
                <span className="text-ink-muted">restorable until {s.restorableUntil ? formatDate(s.restorableUntil) : '—'}</span>
                <Button type="button" variant="secondary" className="min-h-11" onClick={() => void restore(s.id)}>
                  Restore
                </Button>
              </li>
            ))}
          </ul>
        </details>
      )}
      {error && (
        <p role="alert" className="text-sm font-medium text-danger">
          {error}
        </p>
      )}
    </div>
  );
}
