'use client';
// The coach's edit and delete of a session, on its page. Delete asks first and says what happens: the session and
// its recordings go to the bin for 30 days; the athlete's page then offers to undo (restore).
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { deleteJson } from '@/lib/fetcher';
import { ApiError } from '@/lib/fetcher';
import { BIN_DAYS, sessionResponseSchema, type SessionInput } from '@/lib/contracts/sessions';
import { SessionForm } from './session-form';

export function SessionActions({
  session,
  recordingCount,
}: {
  session: { id: number; athleteId: number; sessionDate: string; context: SessionInput['context']; location: string | null; notes: string | null };
  recordingCount: number;
}) {
  const router = useRouter();
  const [mode, setMode] = useState<'idle' | 'edit' | 'confirm'>('idle');
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function remove() {
    setBusy(true);
    setError(null);
    try {
      await deleteJson(`/api/sessions/${session.id}`, sessionResponseSchema);
      router.push(`/athletes/${session.athleteId}?binned=${session.id}`);
    } catch (e) {
      setError(e instanceof ApiError ? e.message : 'Could not delete the session.');
      setBusy(false);
    }
  }

  return (
    <div className="space-y-3" data-testid="session-actions">
      {mode === 'idle' && (
        <div className="flex flex-wrap gap-2">
          <Button type="button" variant="secondary" className="min-h-11" onClick={() => setMode('edit')}>
            Edit session
          </Button>
          <Button type="button" variant="danger" className="min-h-11" onClick={() => setMode('confirm')}>
            Delete session…
          </Button>
        </div>
      )}
      {mode === 'edit' && (
        <SessionForm
          athleteId={session.athleteId}
          session={session}
          idPrefix="edit-session"
          onCancel={() => setMode('idle')}
          onSaved={() => {
            setMode('idle');
            router.refresh();
          }}
        />
      )}
      {mode === 'confirm' && (
        <div role="alertdialog" aria-labelledby="delete-session-title" className="space-y-2 rounded-md border border-danger p-3">
          <p id="delete-session-title" className="text-sm text-ink">
            Delete this session{recordingCount > 0 ? ` and its ${recordingCount === 1 ? 'recording' : `${recordingCount} recordings`}` : ''}? It goes to the bin:
            you can restore it from the player’s page for {BIN_DAYS} days, then it is removed for good.
          </p>
          <div className="flex gap-2">
            <Button type="button" variant="danger" className="min-h-11" disabled={busy} onClick={() => void remove()}>
              Move to bin
            </Button>
            <Button type="button" variant="secondary" className="min-h-11" disabled={busy} onClick={() => setMode('idle')}>
              Keep it
            </Button>
          </div>
        </div>
      )}
      {error && (
        <p role="alert" className="text-sm font-medium text-danger">
          {error}
        </p>
      )}
    </div>
  );
}
