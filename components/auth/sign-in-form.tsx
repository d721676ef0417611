'use client';

import { signIn } from 'next-auth/react';
import { useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';
import { Field, inputClass } from '@/components/ui/field';
import { describeSignInError } from '@/lib/auth/sign-in-errors';
import { z } from 'zod';
import { signInSchema } from '@/lib/contracts/users';

export function SignInForm({ callbackUrl, initialError }: { callbackUrl: string; initialError: string | null }) {
  const [error, setError] = useState<string | null>(initialError);
  const [fieldErrors, setFieldErrors] = useState<{ email?: string; password?: string }>({});
  const [pending, setPending] = useState(false);

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const parsed = signInSchema.safeParse({ email: form.get('email'), password: form.get('password') });
    if (!parsed.success) {
      const flat = z.flattenError(parsed.error).fieldErrors;
      setFieldErrors({ email: flat.email?.[0], password: flat.password?.[0] });
      setError(null);
      return;
    }
    setFieldErrors({});
    setPending(true);
    const result = await signIn('credentials', { ...parsed.data, redirect: false, callbackUrl });
    setPending(false);
    if (!result || result.error) {
      setError(describeSignInError(result?.error ?? 'unknown'));
      return;
    }
    window.location.assign(callbackUrl);
  }

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      {error && (
        <p role="alert" data-testid="sign-in-error" className="rounded-md border border-danger/30 bg-danger-soft px-3 py-2 text-sm text-danger">
          {error}
        </p>
      )}
      <Field id="email" label="Email" error={fieldErrors.email}>
        <input id="email" name="email" type="email" autoComplete="username" required className={inputClass} aria-invalid={Boolean(fieldErrors.email)} />
      </Field>
      <Field id="password" label="Password" error={fieldErrors.password}>
        <input
          id="password"
          name="password"
          type="password"
          autoComplete="current-password"
          required
          className={inputClass}
          aria-invalid={Boolean(fieldErrors.password)}
        />
      </Field>
      <Button type="submit" disabled={pending} className="w-full">
        {pending ? 'Signing in…' : 'Sign in'}
      </Button>
    </form>
  );
}
