'use client';
// The coach's actions on one review: start, deliver (summary and an optional drill), refund before delivery; the
// student's cancel of an unpaid request.
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { ConfirmButton } from '@/components/ui/confirm-button';
import { Field, inputClass } from '@/components/ui/field';
import { ApiError, sendJson } from '@/lib/fetcher';
import { formatMoney, reviewSchema, type Review } from '@/lib/contracts/reviews';

export function ReviewActions({ review, role, drills }: { review: Review; role: 'coach' | 'student'; drills: { id: number; name: string }[] }) {
  const router = useRouter();
  const [summary, setSummary] = useState('');
  const [drillId, setDrillId] = useState('');
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const open = review.status === 'paid' || review.status === 'in_review';

  async function act(path: string, body?: unknown) {
    setError(null);
    setBusy(true);
    try {
      await sendJson(`/api/reviews/${review.id}/${path}`, 'POST', body, reviewSchema);
      router.refresh();
    } catch (e) {
      setError(e instanceof ApiError ? e.message : 'That did not work; try again.');
      throw e;
    } finally {
      setBusy(false);
    }
  }

  const errorLine = error && (
    <p role="alert" className="text-sm font-medium text-danger">
      {error}
    </p>
  );

  if (role === 'student') {
    if (review.status !== 'requested' && review.status !== 'awaiting_payment') return null;
    return (
      <div className="space-y-2">
        <ConfirmButton label="Cancel request…" question="Cancel this request? Nothing has been charged." confirmLabel="Cancel request" onConfirm={() => act('cancel')} />
        {errorLine}
      </div>
    );
  }

  return (
    <div className="space-y-4">
      {review.status === 'paid' && (
        <Button type="button" variant="secondary" disabled={busy} onClick={() => void act('start').catch(() => undefined)}>
          Start this review
        </Button>
      )}
      {open && (
        <form
          className="space-y-4"
          aria-label="Send the review"
          data-testid="deliver-form"
          onSubmit={(e) => {
            e.preventDefault();
            if (summary.trim().length < 10) {
              setError('Write a summary for the student (at least a sentence).');
              return;
            }
            void act('deliver', { summary, ...(drillId ? { drillId: Number(drillId) } : {}) }).catch(() => undefined);
          }}
        >
          <Field id="deliver-summary" label="Summary for the student" hint="Your notes and corrections on the swings go with it.">
            <textarea id="deliver-summary" rows={5} className={inputClass} value={summary} onChange={(e) => setSummary(e.target.value)} />
          </Field>
          <Field id="deliver-drill" label="Drill (optional)">
            <select id="deliver-drill" className={inputClass} value={drillId} onChange={(e) => setDrillId(e.target.value)}>
              <option value="">No drill</option>
              {drills.map((d) => (
                <option key={d.id} value={String(d.id)}>
                  {d.name}
                </option>
              ))}
            </select>
          </Field>
          <Button type="submit" disabled={busy}>
            Send the review
          </Button>
        </form>
      )}
      {open && (
        <ConfirmButton
          label="Refund…"
          question={`Refund ${formatMoney(review.priceCents, review.currency)} to ${review.studentName}? The review closes.`}
          confirmLabel="Refund"
          onConfirm={() => act('refund')}
        />
      )}
      {errorLine}
    </div>
  );
}
