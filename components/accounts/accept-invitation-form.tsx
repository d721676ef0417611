'use client';
// The invited person chooses a password (and may change the name); then the page signs them in with it.
import { zodResolver } from '@hookform/resolvers/zod';
import { signIn } from 'next-auth/react';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { Button } from '@/components/ui/button';
import { Field, inputClass } from '@/components/ui/field';
import { sendJson } from '@/lib/fetcher';
import { applyServerErrors } from '@/lib/forms';
import { acceptInvitationResponseSchema, newPasswordSchema } from '@/lib/contracts/invitations';

const formSchema = z
  .object({
    name: z.string().trim().min(1, { error: 'Enter a name.' }).max(120, { error: 'Use at most 120 characters.' }),
    password: newPasswordSchema,
    repeat: z.string(),
  })
  .refine((v) => v.password === v.repeat, { path: ['repeat'], error: 'The two passwords differ.' });
type FormValues = z.infer<typeof formSchema>;

export function AcceptInvitationForm({ token, email, defaultName }: { token: string; email: string; defaultName: string }) {
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState: { errors, isSubmitting } } = useForm<FormValues>({
    resolver: zodResolver(formSchema),
    defaultValues: { name: defaultName, password: '', repeat: '' },
  });

  async function onSubmit(values: FormValues) {
    setFormError(null);
    try {
      const res = await sendJson('/api/invitations/accept', 'POST', { token, password: values.password, name: values.name }, acceptInvitationResponseSchema);
      const signedIn = await signIn('credentials', { email: res.user.email, password: values.password, redirect: false, callbackUrl: '/' });
      if (!signedIn || signedIn.error) {
        window.location.assign('/sign-in');
        return;
      }
      window.location.assign('/');
    } catch (e) {
      setFormError(applyServerErrors(e, setError, { fields: ['name', 'password'], fallback: 'Could not create the account. Try again.' }));
    }
  }

  return (
    <form onSubmit={handleSubmit(onSubmit)} noValidate className="space-y-4" data-testid="accept-invitation">
      {formError && (
        <p role="alert" className="rounded-md border border-danger/30 bg-danger-soft px-3 py-2 text-sm text-danger">
          {formError}
        </p>
      )}
      <p className="text-sm">
        Account e-mail: <span className="font-medium">{email}</span>
      </p>
      <Field id="invite-name" label="Your name" error={errors.name?.message}>
        <input id="invite-name" autoComplete="name" className={inputClass} aria-invalid={errors.name ? true : undefined} {...register('name')} />
      </Field>
      <Field id="invite-password" label="Choose a password" hint="At least 12 characters." error={errors.password?.message}>
        <input id="invite-password" type="password" autoComplete="new-password" className={inputClass} aria-invalid={errors.password ? true : undefined} {...register('password')} />
      </Field>
      <Field id="invite-repeat" label="Type it again" error={errors.repeat?.message}>
        <input id="invite-repeat" type="password" autoComplete="new-password" className={inputClass} aria-invalid={errors.repeat ? true : undefined} {...register('repeat')} />
      </Field>
      <Button type="submit" disabled={isSubmitting} className="min-h-11 w-full">
        {isSubmitting ? 'Creating your account…' : 'Create my account'}
      </Button>
    </form>
  );
}
