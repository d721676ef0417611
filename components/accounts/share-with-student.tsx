'use client';
// A coach sends the student a link to a lesson summary or to one swing (POST /api/shares). The mail carries only the
// link and the coach's note; the page behind it needs sign-in. Below it, what was already sent to this player
// (components/accounts/sent-shares.tsx), loaded when the control is opened.
import { useState } from 'react';
import useSWR from 'swr';
import { Button } from '@/components/ui/button';
import { inputClass } from '@/components/ui/field';
import { fetchJson, sendJson } from '@/lib/fetcher';
import { serverErrorText } from '@/lib/forms';
import { shareListResponseSchema, shareResponseSchema } from '@/lib/contracts/shares';
import { SentShares } from './sent-shares';

const fetchShares = fetchJson(shareListResponseSchema);

export function ShareWithStudent({ target, athleteId, athleteName }: { target: { sessionId: number } | { swingId: number }; athleteId: number; athleteName: string }) {
  const [open, setOpen] = useState(false);
  const sent = useSWR(open ? `/api/athletes/${athleteId}/shares` : null, fetchShares);
  const [note, setNote] = useState('');
  const [pending, setPending] = useState(false);
  const [status, setStatus] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const what = 'sessionId' in target ? 'this lesson summary' : 'this swing';

  async function send() {
    setPending(true);
    setError(null);
    setStatus(null);
    try {
      await sendJson('/api/shares', 'POST', { ...target, ...(note.trim() ? { note: note.trim() } : {}) }, shareResponseSchema);
      setStatus(`Sent: ${athleteName} has a mail with a link to ${what}, and finds it on their home page.`);
      setNote('');
      void sent.mutate();
    } catch (e) {
      setError(serverErrorText(e, 'Could not send it.'));
    } finally {
      setPending(false);
    }
  }

  return (
    <details className="rounded-lg border border-surface-line bg-surface" data-testid="share-with-student" data-print="hide" onToggle={(e) => setOpen(e.currentTarget.open)}>
      <summary className="flex min-h-11 cursor-pointer items-center px-4 text-sm font-medium text-ink">Send to {athleteName} by e-mail</summary>
      <div className="space-y-3 px-4 pb-4">
        <p className="text-sm text-ink-muted">The mail holds a link to {what}, not its numbers; {athleteName} signs in to see it.</p>
        <label htmlFor="share-note" className="block text-sm font-medium text-ink">
          A note for {athleteName} (optional)
        </label>
        <textarea id="share-note" rows={3} maxLength={500} value={note} onChange={(e) => setNote(e.target.value)} className={inputClass} />
        <Button type="button" className="min-h-11" disabled={pending} onClick={() => void send()}>
          {pending ? 'Sending…' : 'Send'}
        </Button>
        {error && (
          <p role="alert" className="text-sm font-medium text-danger">
            {error}
          </p>
        )}
        <p role="status" className="text-sm text-ink">
          {status}
        </p>
        {open && <SentShares shares={sent.data?.shares} loadError={sent.error} athleteName={athleteName} onChanged={() => void sent.mutate()} />}
      </div>
    </details>
  );
}
