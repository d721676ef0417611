'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { mutate } from 'swr';
import { Button } from '@/components/ui/button';
import { Field, inputClass } from '@/components/ui/field';
import { sendJson } from '@/lib/fetcher';
import { applyServerErrors } from '@/lib/forms';
import { athleteInputSchema, STANCE_WIDTH_MAX_MM, STANCE_WIDTH_MIN_MM, type AthleteInput } from '@/lib/contracts/athletes';
import { athleteResponseSchema } from '@/lib/contracts/athletes';

const emptyToNull = (value: unknown) => (typeof value === 'string' && value.trim() === '' ? null : value);

const defaults: AthleteInput = { displayName: '', handedness: 'right', stanceWidthMm: 400, dateOfBirth: null, homeClub: null };

/** Create (no athleteId) or edit an athlete. The same zod schema validates here and in the API. */
export function AthleteForm({ athleteId, initial }: { athleteId?: number; initial?: AthleteInput }) {
  const router = useRouter();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<AthleteInput>({ resolver: zodResolver(athleteInputSchema), defaultValues: initial ?? defaults });

  async function onSubmit(values: AthleteInput) {
    setFormError(null);
    try {
      const { athlete } = athleteId
        ? await sendJson(`/api/athletes/${athleteId}`, 'PATCH', values, athleteResponseSchema)
        : await sendJson('/api/athletes', 'POST', values, athleteResponseSchema);
      // Drop cached roster lists so the roster shows the change on its next visit.
      await mutate((key) => typeof key === 'string' && key.startsWith('/api/athletes'), undefined, { revalidate: false });
      router.push(`/athletes/${athlete.id}`);
      router.refresh();
    } catch (error) {
      setFormError(applyServerErrors(error, setError, { fields: Object.keys(defaults), fallback: 'Saving failed.' }));
    }
  }

  const describedBy = (name: keyof AthleteInput) => (errors[name] ? `${name}-error` : undefined);

  return (
    <form onSubmit={handleSubmit(onSubmit)} noValidate className="max-w-xl space-y-5" data-testid="athlete-form">
      {formError && (
        <p role="alert" className="rounded-md border border-danger/30 bg-danger-soft px-3 py-2 text-sm text-danger">
          {formError}
        </p>
      )}
      <Field id="displayName" label="Name" error={errors.displayName?.message}>
        <input id="displayName" className={inputClass} aria-invalid={Boolean(errors.displayName)} aria-describedby={describedBy('displayName')} {...register('displayName')} />
      </Field>
      <fieldset className="space-y-1.5">
        <legend className="text-sm font-medium text-ink">Plays</legend>
        <div className="flex gap-6 text-sm">
          <label className="inline-flex items-center gap-2">
            <input type="radio" value="right" {...register('handedness')} /> Right-handed
          </label>
          <label className="inline-flex items-center gap-2">
            <input type="radio" value="left" {...register('handedness')} /> Left-handed
          </label>
        </div>
        {errors.handedness && <p className="text-sm font-medium text-danger">{errors.handedness.message}</p>}
      </fieldset>
      <Field
        id="stanceWidthMm"
        label="Stance width (mm)"
        hint={`Inside heel to inside heel at address, ${STANCE_WIDTH_MIN_MM}-${STANCE_WIDTH_MAX_MM} mm.`}
        error={errors.stanceWidthMm?.message}
      >
        <input
          id="stanceWidthMm"
          type="number"
          inputMode="numeric"
          step={1}
          className={inputClass}
          aria-invalid={Boolean(errors.stanceWidthMm)}
          aria-describedby={describedBy('stanceWidthMm') ?? 'stanceWidthMm-hint'}
          {...register('stanceWidthMm', { valueAsNumber: true })}
        />
      </Field>
      <Field id="dateOfBirth" label="Date of birth (optional)" hint="Players under 18 need a parent's or guardian's consent." error={errors.dateOfBirth?.message}>
        <input
          id="dateOfBirth"
          type="date"
          className={inputClass}
          aria-invalid={Boolean(errors.dateOfBirth)}
          aria-describedby={describedBy('dateOfBirth')}
          {...register('dateOfBirth', { setValueAs: emptyToNull })}
        />
      </Field>
      <Field id="homeClub" label="Home club (optional)" error={errors.homeClub?.message}>
        <input id="homeClub" className={inputClass} aria-invalid={Boolean(errors.homeClub)} aria-describedby={describedBy('homeClub')} {...register('homeClub', { setValueAs: emptyToNull })} />
      </Field>
      <div className="flex items-center gap-3">
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? 'Saving…' : athleteId ? 'Save changes' : 'Add athlete'}
        </Button>
        <Button type="button" variant="secondary" onClick={() => router.back()}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
