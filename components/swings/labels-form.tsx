'use client';
// The coach's labels for one swing: club, strike and flight (trade terms), free tags, a 1-5 rating, and
// "not a swing" (hidden from the stats, restorable). Saved with PATCH /api/swings/:id { labels }.
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Button } from '@/components/ui/button';
import { Field, inputClass } from '@/components/ui/field';
import { applyServerErrors } from '@/lib/forms';
import { labelFormSchema, toFormValues, toLabels, type LabelFormValues } from './label-form-schema';
import { clubLabels, flightLabels, strikeLabels } from './labels';
import { patchSwing } from './swing-api';
import { clubs, flights, strikes, type SwingLabels, type SwingView } from '@/lib/contracts/swings';

export function LabelsForm({ swingId, labels, onSaved }: { swingId: number; labels: SwingLabels; onSaved: (swing: SwingView) => void }) {
  const [formError, setFormError] = useState<string | null>(null);
  const [savedAt, setSavedAt] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting, isDirty },
  } = useForm<LabelFormValues>({ resolver: zodResolver(labelFormSchema), defaultValues: toFormValues(labels) });

  async function onSubmit(values: LabelFormValues) {
    setFormError(null);
    try {
      const { swing } = await patchSwing(swingId, { labels: toLabels(values) });
      reset(toFormValues(swing.labels));
      setSavedAt(new Date().toLocaleTimeString());
      onSaved(swing);
    } catch (error) {
      setFormError(applyServerErrors(error, setError, { fields: Object.keys(values), rename: (path: string) => path.replace(/^labels\./, ''), fallback: 'Could not save the labels.' }));
    }
  }

  const select = (id: keyof LabelFormValues, label: string, options: readonly string[], names: Record<string, string>) => (
    <Field id={`label-${id}`} label={label} error={errors[id]?.message}>
      <select id={`label-${id}`} className={inputClass} aria-invalid={!!errors[id]} {...register(id)}>
        <option value="">—</option>
        {options.map((o) => (
          <option key={o} value={o}>
            {names[o] ?? o}
          </option>
        ))}
      </select>
    </Field>
  );

  return (
    <form onSubmit={handleSubmit(onSubmit)} className="space-y-3" data-testid="labels-form" noValidate>
      <div className="grid gap-3 sm:grid-cols-3">
        {select('club', 'Club', clubs, clubLabels)}
        {select('strike', 'Strike', strikes, strikeLabels)}
        {select('flight', 'Ball flight', flights, flightLabels)}
      </div>
      <Field id="label-tags" label="Tags" hint="Comma-separated, e.g. new grip, windy" error={errors.tags?.message}>
        <input id="label-tags" className={inputClass} aria-invalid={!!errors.tags} {...register('tags')} />
      </Field>
      <fieldset>
        <legend className="text-sm font-medium text-ink">Rating</legend>
        <div className="mt-1 flex flex-wrap gap-3 text-sm">
          {['', '1', '2', '3', '4', '5'].map((r) => (
            <label key={r || 'none'} className="inline-flex items-center gap-1.5">
              <input type="radio" value={r} {...register('rating')} />
              {r ? `${r} / 5` : 'none'}
            </label>
          ))}
        </div>
        {errors.rating && <p className="text-sm text-danger" role="alert">{errors.rating.message}</p>}
      </fieldset>
      <label className="flex items-start gap-2 text-sm text-ink">
        <input type="checkbox" className="mt-0.5" {...register('notASwing')} />
        <span>
          Not a swing <span className="text-ink-muted">(practice motion, waggle, misdetection: left out of the stats; untick to restore)</span>
        </span>
      </label>
      {formError && (
        <p role="alert" className="text-sm text-danger" data-testid="labels-error">
          {formError}
        </p>
      )}
      <div className="flex items-center gap-3">
        <Button type="submit" disabled={isSubmitting || !isDirty}>
          {isSubmitting ? 'Saving…' : 'Save labels'}
        </Button>
        {savedAt && !isDirty && <span className="text-sm text-ink-muted" data-testid="labels-saved">Saved at {savedAt}</span>}
      </div>
    </form>
  );
}
