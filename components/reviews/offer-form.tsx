'use client';
// The coach's remote review offer: price and the days they need (PUT /api/review-offer). Open requests keep the price
// they were made at. "Stop taking requests" withdraws it (DELETE, asked first, then an undo that offers the same values
// again); while withdrawn the form says so and its save button offers again.
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { Button } from '@/components/ui/button';
import { ConfirmButton, UndoLine } from '@/components/ui/confirm-button';
import { Field, inputClass } from '@/components/ui/field';
import { sendJson } from '@/lib/fetcher';
import { applyServerErrors } from '@/lib/forms';
import { formatMoney, REVIEW_CURRENCIES, reviewOfferResponseSchema, type ReviewOffer } from '@/lib/contracts/reviews';

const formSchema = z.object({
  price: z.string().regex(/^\d{1,4}([.,]\d{1,2})?$/, { error: 'Enter a price such as 45 or 45.50.' }),
  currency: z.enum(REVIEW_CURRENCIES, { error: 'Pick a currency.' }),
  turnaroundDays: z.string().regex(/^\d{1,2}$/, { error: 'Enter the days you need, 1 to 14.' }),
});
type FormValues = z.infer<typeof formSchema>;

const describe = (offer: ReviewOffer) => `${formatMoney(offer.priceCents, offer.currency)}, back within ${offer.turnaroundDays} days`;
const WITHDRAWN_TEXT = 'You are not taking review requests: students cannot ask you for one. Requests already made go on as before.';
const statusText = (offer: ReviewOffer | null) =>
  !offer ? 'You have no offer yet: students cannot ask you for remote reviews.' : offer.withdrawnAt ? `${WITHDRAWN_TEXT} Your last offer: ${describe(offer)}.` : `Your offer: ${describe(offer)}.`;

export function OfferForm({ initial }: { initial: ReviewOffer | null }) {
  const [offer, setOffer] = useState<ReviewOffer | null>(initial);
  const [status, setStatus] = useState<string | null>(statusText(initial));
  /** the offer just withdrawn, for the undo line */
  const [undo, setUndo] = useState<ReviewOffer | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState: { errors, isSubmitting } } = useForm<FormValues>({
    resolver: zodResolver(formSchema),
    defaultValues: {
      price: initial ? (initial.priceCents / 100).toFixed(2) : '',
      currency: (initial?.currency as FormValues['currency']) ?? 'EUR',
      turnaroundDays: initial ? String(initial.turnaroundDays) : '3',
    },
  });
  async function onSubmit(values: FormValues) {
    setFormError(null);
    try {
      const priceCents = Math.round(Number(values.price.replace(',', '.')) * 100);
      const res = await sendJson('/api/review-offer', 'PUT', { priceCents, currency: values.currency, turnaroundDays: Number(values.turnaroundDays) }, reviewOfferResponseSchema);
      setOffer(res.offer);
      setUndo(null);
      setStatus(`Saved. Your offer: ${describe(res.offer)}.`);
    } catch (e) {
      setFormError(applyServerErrors(e, setError, { fields: ['currency', 'turnaroundDays'], rename: (p) => (p === 'priceCents' ? 'price' : p), fallback: 'Could not save the offer.' }));
    }
  }
  async function withdraw() {
    const res = await sendJson('/api/review-offer', 'DELETE', undefined, reviewOfferResponseSchema);
    setOffer(res.offer);
    setUndo(res.offer);
    setStatus(statusText(res.offer));
  }
  async function offerAgain(previous: ReviewOffer) {
    const res = await sendJson('/api/review-offer', 'PUT', { priceCents: previous.priceCents, currency: previous.currency, turnaroundDays: previous.turnaroundDays }, reviewOfferResponseSchema);
    setOffer(res.offer);
    setStatus(`Taking requests again. Your offer: ${describe(res.offer)}.`);
  }
  const withdrawn = offer?.withdrawnAt != null;
  return (
    <div>
      {undo && <UndoLine message="You stopped taking review requests." onUndo={() => offerAgain(undo)} onDismiss={() => setUndo(null)} />}
      <form onSubmit={handleSubmit(onSubmit)} noValidate className="grid gap-4 sm:grid-cols-4" aria-label="Remote review offer" data-testid="offer-form">
        <Field id="offer-price" label="Price" hint="What a student pays per review." error={errors.price?.message}>
          <input id="offer-price" inputMode="decimal" className={inputClass} aria-invalid={errors.price ? true : undefined} {...register('price')} />
        </Field>
        <Field id="offer-currency" label="Currency" error={errors.currency?.message}>
          <select id="offer-currency" className={inputClass} {...register('currency')}>
            {REVIEW_CURRENCIES.map((c) => (
              <option key={c} value={c}>
                {c}
              </option>
            ))}
          </select>
        </Field>
        <Field id="offer-days" label="Days to send it back" hint="The due date counts from payment." error={errors.turnaroundDays?.message}>
          <input id="offer-days" inputMode="numeric" className={inputClass} aria-invalid={errors.turnaroundDays ? true : undefined} {...register('turnaroundDays')} />
        </Field>
        <div className="flex items-end">
          <Button type="submit" disabled={isSubmitting}>
            {isSubmitting ? 'Saving…' : withdrawn ? 'Offer again' : 'Save offer'}
          </Button>
        </div>
        {formError && (
          <p role="alert" className="text-sm font-medium text-danger sm:col-span-4">
            {formError}
          </p>
        )}
        <p role="status" className={`text-sm text-ink sm:col-span-4${withdrawn ? ' font-medium' : ''}`} data-testid="offer-status">
          {status}
        </p>
        {offer && !withdrawn && (
          <div className="sm:col-span-4">
            <ConfirmButton
              label="Stop taking requests…"
              question="Stop taking review requests? Students can no longer ask you for a review. Requests already made, paid or in review go on at their own price, and you can offer again at any time."
              confirmLabel="Stop taking requests"
              onConfirm={withdraw}
            />
          </div>
        )}
      </form>
    </div>
  );
}
