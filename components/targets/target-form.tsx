'use client';
// Edit one target (PATCH /api/targets/:id) or make a new one for a club group and, optionally, one player
// (POST /api/targets). Each row is expected ± tolerance for one measure at one event; tempo is optional.
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useFieldArray, useForm } from 'react-hook-form';
import { mutate } from 'swr';
import { Button } from '@/components/ui/button';
import { Field, inputClass } from '@/components/ui/field';
import { sendJson } from '@/lib/fetcher';
import { applyServerErrors } from '@/lib/forms';
import { targetInputSchema, type TargetInput } from '@/lib/contracts/targets';
import { clubGroupLabels, clubGroups, eventLabels, measureLabels, measures, targetEvents, targetResponseSchema, type Target } from '@/lib/contracts/targets';

export const TARGETS_URL = '/api/targets';
const cell = `${inputClass} px-2 py-1`;

export function TargetForm({ target, athletes, onDone }: { target?: Target; athletes: { id: number; displayName: string }[]; onDone: () => void }) {
  const [formError, setFormError] = useState<string | null>(null);
  const [withTempo, setWithTempo] = useState(target?.tempo != null);
  const { register, control, handleSubmit, setError, formState: { errors, isSubmitting } } = useForm({
    resolver: zodResolver(targetInputSchema),
    defaultValues: {
      name: target ? (target.isDefault ? `${target.name} (my copy)` : target.name) : '',
      description: target?.description ?? '',
      clubGroup: target?.clubGroup ?? 'irons',
      athleteId: target?.athleteId ?? null,
      checks: target?.checks ?? [{ event: 'impact', measure: 'leadPct', expected: 85, tolerance: 10 }],
      tempo: target?.tempo ?? { min: 2.5, max: 3.5 },
    },
  });
  const { fields, append, remove } = useFieldArray({ control, name: 'checks' });
  // an academy default is not edited in place: saving makes the coach's own copy
  const editing = target && !target.isDefault;

  async function onSubmit(values: TargetInput) {
    setFormError(null);
    const body = { ...values, tempo: withTempo ? values.tempo : null };
    try {
      await sendJson(editing ? `${TARGETS_URL}/${target.id}` : TARGETS_URL, editing ? 'PATCH' : 'POST', body, targetResponseSchema);
      await mutate(TARGETS_URL);
      onDone();
    } catch (e) {
      setFormError(applyServerErrors(e, setError, { fields: ['name', 'description', 'clubGroup', 'athleteId', 'checks', 'tempo'], fallback: 'Could not save the target.' }));
    }
  }

  return (
    <form onSubmit={handleSubmit(onSubmit)} noValidate className="space-y-3 rounded-md border border-accent/40 p-4" data-testid="target-form">
      <div className="grid gap-3 md:grid-cols-3">
        <Field id="target-name" label="Name" error={errors.name?.message}>
          <input id="target-name" className={inputClass} {...register('name')} />
        </Field>
        <Field id="target-group" label="Club group" error={errors.clubGroup?.message}>
          <select id="target-group" className={inputClass} {...register('clubGroup')}>
            {clubGroups.map((g) => <option key={g} value={g}>{clubGroupLabels[g]}</option>)}
          </select>
        </Field>
        <Field id="target-athlete" label="For" hint="Leave on all players for an academy-wide pattern.">
          <select id="target-athlete" className={inputClass} {...register('athleteId', { setValueAs: (v) => (v === '' || v == null ? null : Number(v)) })}>
            <option value="">All my players</option>
            {athletes.map((a) => <option key={a.id} value={a.id}>{a.displayName}</option>)}
          </select>
        </Field>
      </div>
      <table className="w-full text-sm">
        <thead className="text-left text-sm text-ink-muted">
          <tr><th className="font-medium">Event</th><th className="font-medium">Measure</th><th className="font-medium">Expected</th><th className="font-medium">± Tolerance</th><th /></tr>
        </thead>
        <tbody>
          {fields.map((f, i) => {
            const e = errors.checks?.[i];
            return (
              <tr key={f.id}>
                <td className="pr-2 py-1"><select aria-label={`Check ${i + 1} event`} className={cell} {...register(`checks.${i}.event`)}>{targetEvents.map((x) => <option key={x} value={x}>{eventLabels[x]}</option>)}</select></td>
                <td className="pr-2 py-1"><select aria-label={`Check ${i + 1} measure`} className={cell} {...register(`checks.${i}.measure`)}>{measures.map((x) => <option key={x} value={x}>{measureLabels[x]}</option>)}</select></td>
                <td className="pr-2 py-1">
                  <input aria-label={`Check ${i + 1} expected`} type="number" step="any" className={cell} aria-invalid={e?.expected ? 'true' : 'false'} {...register(`checks.${i}.expected`, { valueAsNumber: true })} />
                  {e?.expected && <p role="alert" className="text-sm text-danger">{e.expected.message}</p>}
                </td>
                <td className="pr-2 py-1">
                  <input aria-label={`Check ${i + 1} tolerance`} type="number" step="any" className={cell} aria-invalid={e?.tolerance ? 'true' : 'false'} {...register(`checks.${i}.tolerance`, { valueAsNumber: true })} />
                  {e?.tolerance && <p role="alert" className="text-sm text-danger">{e.tolerance.message}</p>}
                </td>
                <td className="py-1"><Button type="button" variant="secondary" onClick={() => remove(i)} aria-label={`Remove check ${i + 1}`}>×</Button></td>
              </tr>
            );
          })}
        </tbody>
      </table>
      {errors.checks?.message && <p role="alert" className="text-sm text-danger">{errors.checks.message}</p>}
      <Button type="button" variant="secondary" onClick={() => append({ event: 'impact', measure: 'leadPct', expected: 50, tolerance: 10 })}>Add check</Button>
      <div className="flex flex-wrap items-end gap-3 text-sm">
        <label className="flex items-center gap-2 pb-2"><input type="checkbox" checked={withTempo} onChange={(e) => setWithTempo(e.target.checked)} /> Tempo range (backswing : downswing)</label>
        {withTempo && (
          <>
            <Field id="tempo-min" label="From" error={errors.tempo?.min?.message}><input id="tempo-min" type="number" step="0.1" className={cell} {...register('tempo.min', { valueAsNumber: true })} /></Field>
            <Field id="tempo-max" label="To" error={errors.tempo?.max?.message}><input id="tempo-max" type="number" step="0.1" className={cell} {...register('tempo.max', { valueAsNumber: true })} /></Field>
          </>
        )}
      </div>
      <div className="flex items-center gap-3">
        <Button type="submit" disabled={isSubmitting}>{editing ? 'Save target' : 'Save as my target'}</Button>
        <Button type="button" variant="secondary" onClick={onDone}>Cancel</Button>
        {formError && <p role="alert" className="text-sm text-danger">{formError}</p>}
      </div>
    </form>
  );
}
