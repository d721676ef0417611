'use client';
// Add a drill to the coach's library, or edit one (`drill` given: PATCH /api/drills/:id). The form keeps steps as one per line and the checks as ticks; what is sent is
// the API's own shape, validated with the route's schema (lib/contracts/drills.ts).
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { mutate } from 'swr';
import { Button } from '@/components/ui/button';
import { Field, inputClass } from '@/components/ui/field';
import { sendJson } from '@/lib/fetcher';
import { applyServerErrors } from '@/lib/forms';
import { drillInputSchema } from '@/lib/contracts/drills';
import { drillResponseSchema, type Drill } from '@/lib/contracts/drills';
import { eventLabels, measureLabels, measures, targetEvents } from '@/lib/contracts/targets';
import { ASSIGNMENTS_URL, DRILLS_URL } from './drill-api';

const formSchema = z.object({
  name: z.string(),
  stepsText: z.string().trim().min(1, 'Add at least one step (one per line).'),
  checks: z.array(z.string()),
  cautions: z.string(),
});
type FormValues = z.infer<typeof formSchema>;

const DEFAULT_CAUTION = 'Stop on any pain in the back, neck or hips and see a physician or physiotherapist. Start slowly, half speed first.';

export function DrillForm({ drill, onDone }: { drill?: Drill; onDone?: () => void } = {}) {
  const [done, setDone] = useState<string | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const id = (name: string) => (drill ? `drill-${drill.id}-${name}` : `drill-${name}`);
  const { register, handleSubmit, setError, reset, formState: { errors, isSubmitting } } = useForm<FormValues>({
    resolver: zodResolver(formSchema),
    defaultValues: drill
      ? { name: drill.name, stepsText: drill.steps.join('\n'), checks: drill.addressesChecks.map((c) => `${c.event}.${c.measure}`), cautions: drill.cautions }
      : { name: '', stepsText: '', checks: [], cautions: DEFAULT_CAUTION },
  });

  async function onSubmit(v: FormValues) {
    setFormError(null);
    setDone(null);
    const body = {
      name: v.name,
      steps: v.stepsText.split('\n').map((s) => s.trim()).filter(Boolean),
      addressesChecks: v.checks.map((c) => {
        const [event, measure] = c.split('.');
        return { event, measure };
      }),
      cautions: v.cautions,
    };
    const parsed = drillInputSchema.safeParse(body);
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const f = issue.path[0] === 'steps' ? 'stepsText' : issue.path[0] === 'addressesChecks' ? 'checks' : issue.path[0];
        if (f === 'name' || f === 'stepsText' || f === 'cautions' || f === 'checks') setError(f, { message: issue.message });
      }
      return;
    }
    try {
      if (drill) {
        await sendJson(`${DRILLS_URL}/${drill.id}`, 'PATCH', parsed.data, drillResponseSchema);
        await Promise.all([mutate(DRILLS_URL), mutate(ASSIGNMENTS_URL)]);
        onDone?.();
        return;
      }
      await sendJson(DRILLS_URL, 'POST', parsed.data, drillResponseSchema);
      setDone(`Added “${parsed.data.name}”.`);
      reset({ name: '', stepsText: '', checks: [], cautions: DEFAULT_CAUTION });
      await mutate(DRILLS_URL);
    } catch (e) {
      const rename = (path: string) => path.replace(/^steps\b/, 'stepsText').replace(/^addressesChecks\b.*/, 'checks');
      setFormError(applyServerErrors(e, setError, { fields: ['name', 'stepsText', 'cautions', 'checks'], rename, fallback: 'Could not save the drill.' }));
    }
  }

  return (
    <form onSubmit={handleSubmit(onSubmit)} noValidate className="space-y-3" data-testid="drill-form">
      <Field id={id('name')} label="Drill name" error={errors.name?.message}>
        <input id={id('name')} className={inputClass} {...register('name')} />
      </Field>
      <Field id={id('steps')} label="Steps" hint="One step per line." error={errors.stepsText?.message}>
        <textarea id={id('steps')} rows={4} className={inputClass} {...register('stepsText')} />
      </Field>
      <fieldset>
        <legend className="text-sm font-medium text-ink">Checks it works on</legend>
        <div className="mt-1 grid grid-cols-2 gap-x-4 gap-y-1 text-sm md:grid-cols-4">
          {targetEvents.flatMap((e) =>
            measures.map((m) => (
              <label key={`${e}.${m}`} className="flex min-h-11 items-center gap-1.5">
                <input type="checkbox" value={`${e}.${m}`} {...register('checks')} /> {measureLabels[m]} at {eventLabels[e].toLowerCase()}
              </label>
            )),
          )}
        </div>
        {errors.checks && <p role="alert" className="text-sm text-danger">{errors.checks.message}</p>}
      </fieldset>
      <Field id={id('cautions')} label="Cautions" hint="What the player must watch for; shown with the drill wherever it appears." error={errors.cautions?.message}>
        <textarea id={id('cautions')} rows={2} className={inputClass} {...register('cautions')} />
      </Field>
      <div className="flex items-center gap-3">
        <Button type="submit" disabled={isSubmitting}>{drill ? 'Save changes' : 'Add drill'}</Button>
        {drill && (
          <Button type="button" variant="secondary" onClick={onDone}>
            Cancel
          </Button>
        )}
        {done && <p role="status" className="text-sm text-ok">{done}</p>}
        {formError && <p role="alert" className="text-sm text-danger">{formError}</p>}
      </div>
    </form>
  );
}
