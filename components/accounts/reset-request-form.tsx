'use client';
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Button } from '@/components/ui/button';
import { Field, inputClass } from '@/components/ui/field';
import { sendJson } from '@/lib/fetcher';
import { applyServerErrors } from '@/lib/forms';
import { passwordResetAcceptedSchema, passwordResetRequestSchema } from '@/lib/contracts/password-reset';
import type { z } from 'zod';

type FormValues = z.input<typeof passwordResetRequestSchema>;

export function ResetRequestForm() {
  const [formError, setFormError] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState: { errors, isSubmitting } } = useForm<FormValues>({ resolver: zodResolver(passwordResetRequestSchema), defaultValues: { email: '' } });

  async function onSubmit(values: FormValues) {
    setFormError(null);
    try {
      const res = await sendJson('/api/password-reset', 'POST', values, passwordResetAcceptedSchema);
      setDone(res.message);
    } catch (e) {
      setFormError(applyServerErrors(e, setError, { fields: ['email'], fallback: 'Could not send the request. Try again.' }));
    }
  }

  if (done) {
    return (
      <p role="status" className="text-sm" data-testid="reset-requested">
        {done}
      </p>
    );
  }
  return (
    <form onSubmit={handleSubmit(onSubmit)} noValidate className="space-y-4">
      {formError && (
        <p role="alert" className="rounded-md border border-danger/30 bg-danger-soft px-3 py-2 text-sm text-danger">
          {formError}
        </p>
      )}
      <Field id="reset-email" label="Email" error={errors.email?.message}>
        <input id="reset-email" type="email" autoComplete="username" className={inputClass} aria-invalid={errors.email ? true : undefined} {...register('email')} />
      </Field>
      <Button type="submit" disabled={isSubmitting} className="min-h-11 w-full">
        Send me a link
      </Button>
    </form>
  );
}
