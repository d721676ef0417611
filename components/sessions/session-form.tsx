'use client';
// A session's date, context, place and notes: creates one (POST /api/athletes/:id/sessions) or edits one
// (PATCH /api/sessions/:id). Validated with the route's own schema; the server's field errors go onto the fields.
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Button } from '@/components/ui/button';
import { Field, inputClass } from '@/components/ui/field';
import { contextLabels } from '@/components/ui/format';
import { sendJson } from '@/lib/fetcher';
import { applyServerErrors } from '@/lib/forms';
import { sessionContextValues } from '@/lib/contracts/athletes';
import { sessionInputSchema, sessionResponseSchema, type SessionInput, type SessionResponse } from '@/lib/contracts/sessions';

const FIELDS = ['date', 'context', 'location', 'notes'] as const;

export function SessionForm({
  athleteId,
  session,
  onSaved,
  onCancel,
  idPrefix = 'session',
}: {
  athleteId: number;
  /** the session to edit; without it the form creates one */
  session?: { id: number; sessionDate: string; context: SessionInput['context']; location: string | null; notes: string | null };
  onSaved: (saved: SessionResponse) => void;
  onCancel?: () => void;
  idPrefix?: string;
}) {
  const [formError, setFormError] = useState<string | null>(null);
  const today = new Date().toISOString().slice(0, 10);
  const { register, handleSubmit, setError, formState: { errors, isSubmitting } } = useForm<SessionInput>({
    resolver: zodResolver(sessionInputSchema),
    defaultValues: session
      ? { date: session.sessionDate, context: session.context, location: session.location ?? '', notes: session.notes ?? '' }
      : { date: today, context: 'lesson', location: '', notes: '' },
  });
  const id = (name: string) => `${idPrefix}-${name}`;

  async function onSubmit(values: SessionInput) {
    setFormError(null);
    try {
      const body = sessionInputSchema.parse(values);
      const saved = session
        ? await sendJson(`/api/sessions/${session.id}`, 'PATCH', body, sessionResponseSchema)
        : await sendJson(`/api/athletes/${athleteId}/sessions`, 'POST', body, sessionResponseSchema);
      onSaved(saved);
    } catch (e) {
      setFormError(applyServerErrors(e, setError, { fields: FIELDS, fallback: 'Could not save the session.' }));
    }
  }

  return (
    <form onSubmit={handleSubmit(onSubmit)} noValidate className="space-y-3" data-testid="session-form">
      <div className="grid gap-3 sm:grid-cols-2">
        <Field id={id('date')} label="Date" error={errors.date?.message}>
          <input id={id('date')} type="date" className={inputClass} aria-invalid={errors.date ? true : undefined} {...register('date')} />
        </Field>
        <Field id={id('context')} label="Kind of session" error={errors.context?.message}>
          <select id={id('context')} className={inputClass} aria-invalid={errors.context ? true : undefined} {...register('context')}>
            {sessionContextValues.map((c) => (
              <option key={c} value={c}>
                {contextLabels[c]}
              </option>
            ))}
          </select>
        </Field>
      </div>
      <Field id={id('location')} label="Place" hint="Range bay, course and hole, studio …" error={errors.location?.message}>
        <input id={id('location')} className={inputClass} aria-invalid={errors.location ? true : undefined} {...register('location')} />
      </Field>
      <Field id={id('notes')} label="Notes" error={errors.notes?.message}>
        <textarea id={id('notes')} rows={2} className={inputClass} aria-invalid={errors.notes ? true : undefined} {...register('notes')} />
      </Field>
      {formError && (
        <p role="alert" className="text-sm font-medium text-danger">
          {formError}
        </p>
      )}
      <div className="flex gap-2">
        <Button type="submit" disabled={isSubmitting} className="min-h-11">
          {session ? 'Save session' : 'Create session'}
        </Button>
        {onCancel && (
          <Button type="button" variant="secondary" onClick={onCancel} className="min-h-11">
            Cancel
          </Button>
        )}
      </div>
    </form>
  );
}
