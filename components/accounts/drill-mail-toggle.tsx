'use client';
// The student's opt-out of drill reminder mails (PATCH /api/me/mail-preferences).
import { useState } from 'react';
import { sendJson } from '@/lib/fetcher';
import { serverErrorText } from '@/lib/forms';
import { mailPreferencesResponseSchema } from '@/lib/contracts/mail-preferences';

export function DrillMailToggle({ initial }: { initial: boolean }) {
  const [on, setOn] = useState(initial);
  const [pending, setPending] = useState(false);
  const [message, setMessage] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);

  async function change(next: boolean) {
    setPending(true);
    setError(null);
    try {
      const res = await sendJson('/api/me/mail-preferences', 'PATCH', { drillReminders: next }, mailPreferencesResponseSchema);
      setOn(res.preferences.drillReminders);
      setMessage(res.preferences.drillReminders ? 'Drill reminders are on.' : 'Drill reminders are off. Your drills stay on your drills page.');
    } catch (e) {
      setError(serverErrorText(e, 'Could not save your choice.'));
    } finally {
      setPending(false);
    }
  }

  return (
    <div className="space-y-2 text-sm" data-testid="drill-mail-toggle">
      <label className="flex min-h-11 cursor-pointer items-center gap-3">
        <input type="checkbox" className="h-5 w-5" checked={on} disabled={pending} onChange={(e) => void change(e.target.checked)} />
        <span>E-mail me when my coach gives me a drill or one is due tomorrow (at most one mail a day)</span>
      </label>
      {error && (
        <p role="alert" className="font-medium text-danger">
          {error}
        </p>
      )}
      <p role="status" className="text-ink-muted">
        {message}
      </p>
    </div>
  );
}
