'use client';
// Link a student account to a player by its e-mail address (POST /api/athletes/:id/account), or unlink it. On a
// player's page the player is fixed; on the admin's accounts page the admin picks the player.
import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { Button } from '@/components/ui/button';
import { Field, inputClass } from '@/components/ui/field';
import { ApiError, deleteJson, sendJson } from '@/lib/fetcher';
import { applyServerErrors } from '@/lib/forms';
import { accountLinkInputSchema, accountLinkResponseSchema, type AccountLinkResponse } from '@/lib/contracts/account-links';

const formSchema = accountLinkInputSchema.extend({ athleteId: z.string().min(1, { error: 'Choose a player.' }) });
type FormValues = z.input<typeof formSchema>;

export function AccountLinkForm({
  athleteId,
  athletes,
  account,
}: {
  /** the player of this page; without it the form offers `athletes` */
  athleteId?: number;
  athletes?: { id: number; displayName: string }[];
  account?: AccountLinkResponse['account'];
}) {
  const router = useRouter();
  const [linked, setLinked] = useState(account ?? null);
  const [formError, setFormError] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const { register, handleSubmit, setError, reset, formState: { errors, isSubmitting } } = useForm<FormValues>({
    resolver: zodResolver(formSchema),
    defaultValues: { email: '', athleteId: athleteId ? String(athleteId) : '' },
  });

  async function onSubmit(values: FormValues) {
    setFormError(null);
    setDone(null);
    try {
      const res = await sendJson(`/api/athletes/${values.athleteId}/account`, 'POST', { email: values.email }, accountLinkResponseSchema);
      setLinked(athleteId ? res.account : null);
      const name = athletes?.find((a) => a.id === res.athleteId)?.displayName;
      setDone(`Linked ${res.account?.email}${name ? ` to ${name}` : ''}.`);
      reset({ email: '', athleteId: athleteId ? String(athleteId) : '' });
      router.refresh();
    } catch (e) {
      setFormError(applyServerErrors(e, setError, { fields: ['email'], fallback: 'Could not link the account.' }));
    }
  }

  async function unlink() {
    if (!athleteId) return;
    setFormError(null);
    try {
      await deleteJson(`/api/athletes/${athleteId}/account`, accountLinkResponseSchema);
      setLinked(null);
      setDone('Unlinked. The student no longer sees this player.');
      router.refresh();
    } catch (e) {
      setFormError(e instanceof ApiError ? e.message : 'Could not unlink the account.');
    }
  }

  return (
    <div className="space-y-3" data-testid="account-link">
      {athleteId && linked && (
        <p className="flex flex-wrap items-center gap-3 text-sm">
          <span>
            Student account: <span className="font-medium">{linked.name}</span> ({linked.email})
          </span>
          <Button type="button" variant="secondary" className="min-h-11" onClick={() => void unlink()}>
            Unlink
          </Button>
        </p>
      )}
      {!(athleteId && linked) && (
        <form onSubmit={handleSubmit(onSubmit)} noValidate className="flex flex-wrap items-end gap-3">
          {!athleteId && (
            <Field id="link-athlete" label="Player" error={errors.athleteId?.message}>
              <select id="link-athlete" className={inputClass} {...register('athleteId')}>
                <option value="">Choose a player…</option>
                {(athletes ?? []).map((a) => (
                  <option key={a.id} value={String(a.id)}>
                    {a.displayName}
                  </option>
                ))}
              </select>
            </Field>
          )}
          <Field id="link-email" label="Student account e-mail" error={errors.email?.message}>
            <input id="link-email" type="email" className={inputClass} aria-invalid={errors.email ? true : undefined} {...register('email')} />
          </Field>
          <Button type="submit" className="min-h-11" disabled={isSubmitting}>
            Link account
          </Button>
        </form>
      )}
      {formError && (
        <p role="alert" className="text-sm font-medium text-danger">
          {formError}
        </p>
      )}
      {done && (
        <p role="status" className="text-sm text-ink">
          {done}
        </p>
      )}
    </div>
  );
}
