'use client';
import { zodResolver } from '@hookform/resolvers/zod';
import Link from 'next/link';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { Button } from '@/components/ui/button';
import { Field, inputClass } from '@/components/ui/field';
import { sendJson } from '@/lib/fetcher';
import { applyServerErrors } from '@/lib/forms';
import { newPasswordSchema } from '@/lib/contracts/invitations';
import { passwordResetDoneSchema } from '@/lib/contracts/password-reset';

const formSchema = z
  .object({ password: newPasswordSchema, repeat: z.string() })
  .refine((v) => v.password === v.repeat, { path: ['repeat'], error: 'The two passwords differ.' });
type FormValues = z.infer<typeof formSchema>;

export function ResetConfirmForm({ token }: { token: string }) {
  const [formError, setFormError] = useState<string | null>(null);
  const [done, setDone] = useState(false);
  const { register, handleSubmit, setError, formState: { errors, isSubmitting } } = useForm<FormValues>({ resolver: zodResolver(formSchema), defaultValues: { password: '', repeat: '' } });

  async function onSubmit(values: FormValues) {
    setFormError(null);
    try {
      await sendJson('/api/password-reset/confirm', 'POST', { token, password: values.password }, passwordResetDoneSchema);
      setDone(true);
    } catch (e) {
      setFormError(applyServerErrors(e, setError, { fields: ['password'], fallback: 'Could not change the password. Try again.' }));
    }
  }

  if (done) {
    return (
      <div role="status" className="space-y-3 text-sm" data-testid="reset-done">
        <p>Your password is changed. Every other session of your account has been signed out.</p>
        <Link href="/sign-in" className="inline-flex min-h-11 items-center font-medium text-accent underline">
          Sign in with the new password
        </Link>
      </div>
    );
  }
  return (
    <form onSubmit={handleSubmit(onSubmit)} noValidate className="space-y-4">
      {formError && (
        <p role="alert" className="rounded-md border border-danger/30 bg-danger-soft px-3 py-2 text-sm text-danger">
          {formError}
        </p>
      )}
      <Field id="reset-password" label="New password" hint="At least 12 characters." error={errors.password?.message}>
        <input id="reset-password" type="password" autoComplete="new-password" className={inputClass} aria-invalid={errors.password ? true : undefined} {...register('password')} />
      </Field>
      <Field id="reset-repeat" label="Type it again" error={errors.repeat?.message}>
        <input id="reset-repeat" type="password" autoComplete="new-password" className={inputClass} aria-invalid={errors.repeat ? true : undefined} {...register('repeat')} />
      </Field>
      <Button type="submit" disabled={isSubmitting} className="min-h-11 w-full">
        Save the new password
      </Button>
    </form>
  );
}
