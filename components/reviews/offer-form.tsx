'use client';
// The coach's remote review offer: price and the days they need (PUT /api/review-offer). Open requests keep the price
// they were made at.
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { Button } from '@/components/ui/button';
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

export function OfferForm({ initial }: { initial: ReviewOffer | null }) {
  const [status, setStatus] = useState<string | null>(initial ? `Your offer: ${formatMoney(initial.priceCents, initial.currency)}, back within ${initial.turnaroundDays} days.` : 'You have no offer yet: students cannot ask you for remote reviews.');
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
      setStatus(`Saved. Your offer: ${formatMoney(res.offer.priceCents, res.offer.currency)}, back within ${res.offer.turnaroundDays} days.`);
    } catch (e) {
      setFormError(applyServerErrors(e, setError, { fields: ['currency', 'turnaroundDays'], rename: (p) => (p === 'priceCents' ? 'price' : p), fallback: 'Could not save the offer.' }));
    }
  }
  return (
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
          {isSubmitting ? 'Saving…' : 'Save offer'}
        </Button>
      </div>
      {formError && (
        <p role="alert" className="text-sm font-medium text-danger sm:col-span-4">
          {formError}
        </p>
      )}
      <p role="status" className="text-sm text-ink sm:col-span-4" data-testid="offer-status">
        {status}
      </p>
    </form>
  );
}
