'use client';
// The student's request: one ready recording and a question; on 201 the browser goes to the payment page.
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { Button } from '@/components/ui/button';
import { Field, inputClass } from '@/components/ui/field';
import { formatDate } from '@/components/ui/format';
import { sendJson } from '@/lib/fetcher';
import { applyServerErrors } from '@/lib/forms';
import { formatMoney, reviewCreatedSchema, type EligibleRecording, type ReviewOffer } from '@/lib/contracts/reviews';

const formSchema = z.object({
  recordingId: z.string().min(1, { error: 'Pick a recording.' }),
  question: z.string().trim().min(5, { error: 'Write at least a few words (5+ characters).' }).max(2000, { error: 'Use at most 2000 characters.' }),
});
type FormValues = z.infer<typeof formSchema>;

export function RequestForm({ offer, recordings }: { offer: ReviewOffer; recordings: EligibleRecording[] }) {
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState: { errors, isSubmitting } } = useForm<FormValues>({
    resolver: zodResolver(formSchema),
    defaultValues: { recordingId: recordings[0] ? String(recordings[0].id) : '', question: '' },
  });
  async function onSubmit(values: FormValues) {
    setFormError(null);
    try {
      const res = await sendJson('/api/reviews', 'POST', { recordingId: Number(values.recordingId), question: values.question }, reviewCreatedSchema);
      window.location.assign(res.checkoutUrl);
    } catch (e) {
      setFormError(applyServerErrors(e, setError, { fields: ['recordingId', 'question'], fallback: 'Could not send the request.' }));
    }
  }
  if (recordings.length === 0) return <p className="text-sm text-ink-muted">You have no processed recordings yet. Once your coach or you upload one and it is ready, you can ask for a review here.</p>;
  return (
    <form onSubmit={handleSubmit(onSubmit)} noValidate className="space-y-4" aria-label="Ask for a review" data-testid="request-form">
      <Field id="request-recording" label="Recording" error={errors.recordingId?.message}>
        <select id="request-recording" className={inputClass} aria-invalid={errors.recordingId ? true : undefined} {...register('recordingId')}>
          {recordings.map((r) => (
            <option key={r.id} value={String(r.id)}>
              {formatDate(r.sessionDate)} · {r.filename} · {r.swingCount} {r.swingCount === 1 ? 'swing' : 'swings'}
            </option>
          ))}
        </select>
      </Field>
      <Field id="request-question" label="What should your coach look at?" hint="For example: does my weight reach the lead foot early enough?" error={errors.question?.message}>
        <textarea id="request-question" rows={4} className={inputClass} aria-invalid={errors.question ? true : undefined} {...register('question')} />
      </Field>
      <Button type="submit" disabled={isSubmitting}>
        {isSubmitting ? 'Opening payment…' : `Continue to payment (${formatMoney(offer.priceCents, offer.currency)})`}
      </Button>
      {formError && (
        <p role="alert" className="text-sm font-medium text-danger">
          {formError}
        </p>
      )}
    </form>
  );
}
