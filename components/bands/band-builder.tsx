'use client';
// Build a reference band from picked swings: the swings are registered at their events onto the 0-100 % swing axis
// on the server and summarised as mean ± k SD (POST /api/bands). A 422 (fewer than 3 usable swings) is shown as is.
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { mutate } from 'swr';
import { Button } from '@/components/ui/button';
import { Field, inputClass } from '@/components/ui/field';
import { contextLabels, formatDate } from '@/components/ui/format';
import { sendJson } from '@/lib/fetcher';
import { applyServerErrors } from '@/lib/forms';
import { bandCreatedSchema, bandInputSchema, type BandInput } from '@/lib/contracts/bands';
import type { AthleteChoice } from '@/lib/contracts/bands';

const fmt = (v: number | null, d: number, unit = '') => (v == null ? '—' : `${v.toFixed(d)}${unit}`);

export function BandBuilder({ athletes }: { athletes: AthleteChoice[] }) {
  const [athleteId, setAthleteId] = useState<number | null>(athletes[0]?.id ?? null);
  const [result, setResult] = useState<string | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  // the server's own schema (POST /api/bands): the same minimum of swings, the same limits on k and the name
  const { register, handleSubmit, watch, setValue, reset, setError, formState: { errors, isSubmitting } } = useForm({
    resolver: zodResolver(bandInputSchema),
    defaultValues: { name: '', k: 1, shared: false, swingIds: [] },
  });
  const picked = watch('swingIds');
  const athlete = athletes.find((a) => a.id === athleteId) ?? null;

  const toggle = (id: number) => setValue('swingIds', picked.includes(id) ? picked.filter((x) => x !== id) : [...picked, id], { shouldValidate: picked.length > 0 });

  async function onSubmit(values: BandInput) {
    setFormError(null);
    setResult(null);
    try {
      const made = await sendJson('/api/bands', 'POST', values, bandCreatedSchema);
      setResult(`Band “${values.name}” built from ${made.swingCount} swings.`);
      reset({ name: '', k: values.k, shared: values.shared, swingIds: [] });
      await mutate('/api/bands');
    } catch (e) {
      setFormError(applyServerErrors(e, setError, { fields: ['name', 'k', 'shared', 'swingIds'], fallback: 'Could not build the band.' }));
    }
  }

  if (athletes.length === 0) return <p className="text-sm text-ink-muted">None of your athletes has processed swings yet.</p>;
  return (
    <form onSubmit={handleSubmit(onSubmit)} className="space-y-4" noValidate data-testid="band-builder">
      <div className="grid gap-4 md:grid-cols-4">
        <Field id="band-name" label="Band name" error={errors.name?.message}>
          <input id="band-name" className={inputClass} {...register('name')} aria-invalid={errors.name ? 'true' : 'false'} />
        </Field>
        <Field id="band-k" label="Band width (typical spreads)" hint="1 covers about two thirds of these swings’ values, 2 nearly all (exact: mean ± k SD, sample standard deviation)." error={errors.k?.message}>
          <input id="band-k" type="number" step="0.5" className={inputClass} {...register('k', { valueAsNumber: true })} aria-invalid={errors.k ? 'true' : 'false'} />
        </Field>
        <Field id="band-athlete" label="Swings of">
          <select id="band-athlete" className={inputClass} value={athleteId ?? ''} onChange={(e) => setAthleteId(Number(e.target.value))}>
            {athletes.map((a) => (
              <option key={a.id} value={a.id}>{a.displayName}</option>
            ))}
          </select>
        </Field>
        <label className="flex items-center gap-2 self-end pb-2 text-sm text-ink">
          <input type="checkbox" {...register('shared')} /> Share with the academy’s coaches
        </label>
      </div>
      <fieldset className="rounded-md border border-surface-line p-3">
        <legend className="px-1 text-sm font-medium text-ink">Swings ({picked.length} picked; ticks stay when you switch player)</legend>
        {athlete && athlete.sessions.length === 0 && <p className="text-sm text-ink-muted">No processed swings for this athlete.</p>}
        <div className="max-h-72 space-y-3 overflow-y-auto">
          {athlete?.sessions.map((s) => (
            <div key={s.id}>
              <p className="text-sm font-semibold text-ink-muted">{formatDate(s.date)} · {contextLabels[s.context as keyof typeof contextLabels] ?? s.context}</p>
              <ul className="mt-1 flex flex-wrap gap-2">
                {s.swings.map((w) => (
                  <li key={w.id}>
                    <label className="flex items-center gap-1.5 rounded border border-surface-line px-2 py-1 text-sm">
                      <input type="checkbox" checked={picked.includes(w.id)} onChange={() => toggle(w.id)} data-swing-choice={w.id} aria-label={`Swing ${w.index}, ${formatDate(s.date)}`} />
                      Swing {w.index}
                      <span className="text-sm text-ink-muted">lead {fmt(w.leadPctAtImpact, 0, ' %')} · tempo {fmt(w.tempoRatio, 1)}</span>
                    </label>
                  </li>
                ))}
              </ul>
            </div>
          ))}
        </div>
        {errors.swingIds && <p role="alert" className="mt-2 text-sm font-medium text-danger" data-field-error="swingIds">{errors.swingIds.message}</p>}
      </fieldset>
      <div className="flex items-center gap-3">
        <Button type="submit" disabled={isSubmitting}>{isSubmitting ? 'Building…' : 'Build band'}</Button>
        {result && <p role="status" className="text-sm text-ok" data-testid="band-built">{result}</p>}
        {formError && <p role="alert" className="text-sm text-danger" data-testid="band-error">{formError}</p>}
      </div>
    </form>
  );
}
