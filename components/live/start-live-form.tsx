'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { liveStartedSchema } from '@/lib/contracts/live';

const field = 'mt-1 block min-h-11 w-full rounded-md border border-surface-line bg-surface px-3 text-base text-ink';

export function StartLiveForm({ athletes }: { athletes: { id: number; displayName: string }[] }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  return (
    <form
      data-testid="live-start-form"
      className="grid max-w-xl gap-4"
      onSubmit={async (e) => {
        e.preventDefault();
        const form = new FormData(e.currentTarget);
        setBusy(true);
        setError(null);
        const res = await fetch('/api/live', {
          method: 'POST',
          headers: { 'content-type': 'application/json' },
          body: JSON.stringify({ athleteId: Number(form.get('athleteId')), context: form.get('context'), drillFocus: String(form.get('drillFocus') ?? '') }),
        });
        const body = await res.json().catch(() => null);
        if (res.status !== 201) {
          setBusy(false);
          setError(body?.error?.message ?? 'The live lesson could not start.');
          return;
        }
        const { id, token } = liveStartedSchema.parse(body);
        // the token is shown once, on the live screen, for setting up the insoles' bridge
        sessionStorage.setItem(`stanceline-live-token-${id}`, token);
        router.push(`/live/${id}`);
      }}
    >
      <label className="text-sm font-medium text-ink">
        Student
        <select name="athleteId" className={field} defaultValue={athletes[0].id}>
          {athletes.map((a) => (
            <option key={a.id} value={a.id}>
              {a.displayName}
            </option>
          ))}
        </select>
      </label>
      <label className="text-sm font-medium text-ink">
        Session
        <select name="context" className={field} defaultValue="lesson">
          <option value="lesson">Lesson</option>
          <option value="practice">Practice</option>
          <option value="on-course">On the course</option>
        </select>
      </label>
      <label className="text-sm font-medium text-ink">
        Drill in focus <span className="font-normal text-ink-muted">(optional)</span>
        <input name="drillFocus" maxLength={200} className={field} placeholder="e.g. Hold the finish for three seconds" />
      </label>
      {error && (
        <p role="alert" className="text-sm text-danger">
          {error}
        </p>
      )}
      <div>
        <Button type="submit" disabled={busy} className="min-h-11">
          {busy ? 'Starting…' : 'Start live lesson'}
        </Button>
      </div>
    </form>
  );
}
