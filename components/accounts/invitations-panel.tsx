'use client';
// Invite by e-mail (POST /api/invitations) and manage the pending invitations: send again (a new 72 h link) or
// withdraw. A coach invites students for a player on their roster; an admin any role, a player optional for students.
import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Field, inputClass } from '@/components/ui/field';
import { formatDate, roleLabels } from '@/components/ui/format';
import { ApiError, deleteJson, sendJson } from '@/lib/fetcher';
import { applyServerErrors } from '@/lib/forms';
import { invitationResponseSchema, type Invitation } from '@/lib/contracts/invitations';
import { emailSchema, roleValues, type Role } from '@/lib/contracts/users';

const formSchema = z.object({
  email: emailSchema,
  role: z.enum(roleValues, { error: 'Choose a role.' }),
  athleteId: z.string(),
});
type FormValues = z.input<typeof formSchema>;

export function InvitationsPanel({
  viewerRole,
  players,
  initial,
}: {
  viewerRole: 'admin' | 'coach';
  players: { id: number; displayName: string; linked: boolean }[];
  initial: Invitation[];
}) {
  const router = useRouter();
  const [invitations, setInvitations] = useState(initial);
  const [formError, setFormError] = useState<string | null>(null);
  const [status, setStatus] = useState<string | null>(null);
  const { register, handleSubmit, setError, reset, watch, formState: { errors, isSubmitting } } = useForm<FormValues>({
    resolver: zodResolver(formSchema),
    defaultValues: { email: '', role: 'student', athleteId: '' },
  });
  const role = watch('role') as Role;
  const open = players.filter((p) => !p.linked);

  async function onSubmit(values: FormValues) {
    setFormError(null);
    setStatus(null);
    if (viewerRole === 'coach' && !values.athleteId) {
      setError('athleteId', { type: 'required', message: 'Choose the player this student account is for.' });
      return;
    }
    const athleteId = values.role === 'student' && values.athleteId ? Number(values.athleteId) : null;
    try {
      const res = await sendJson('/api/invitations', 'POST', { email: values.email, role: values.role, athleteId }, invitationResponseSchema);
      setInvitations((list) => [res.invitation, ...list.filter((i) => i.email !== res.invitation.email)]);
      setStatus(`Invitation sent to ${res.invitation.email}.`);
      reset({ email: '', role: values.role, athleteId: '' });
      router.refresh();
    } catch (e) {
      setFormError(applyServerErrors(e, setError, { fields: ['email', 'role', 'athleteId'], fallback: 'Could not send the invitation.' }));
    }
  }

  async function resend(invitation: Invitation) {
    setFormError(null);
    try {
      const res = await sendJson(`/api/invitations/${invitation.id}/resend`, 'POST', undefined, invitationResponseSchema);
      setInvitations((list) => list.map((i) => (i.id === invitation.id ? res.invitation : i)));
      setStatus(`A new link went to ${invitation.email}; the previous one no longer works.`);
    } catch (e) {
      setFormError(e instanceof ApiError ? e.message : 'Could not send it again.');
    }
  }

  async function withdraw(invitation: Invitation) {
    setFormError(null);
    try {
      await deleteJson(`/api/invitations/${invitation.id}`);
      setInvitations((list) => list.filter((i) => i.id !== invitation.id));
      setStatus(`Invitation to ${invitation.email} withdrawn; its link no longer works.`);
    } catch (e) {
      setFormError(e instanceof ApiError ? e.message : 'Could not withdraw it.');
    }
  }

  return (
    <div className="space-y-6">
      <form onSubmit={handleSubmit(onSubmit)} noValidate className="grid gap-4 sm:grid-cols-2" data-testid="invite-form" aria-label="Invite by e-mail">
        <Field id="invite-email" label="E-mail address" error={errors.email?.message}>
          <input id="invite-email" type="email" className={inputClass} aria-invalid={errors.email ? true : undefined} {...register('email')} />
        </Field>
        {viewerRole === 'admin' ? (
          <Field id="invite-role" label="Role" error={errors.role?.message}>
            <select id="invite-role" className={inputClass} {...register('role')}>
              {roleValues.map((r) => (
                <option key={r} value={r}>
                  {roleLabels[r]}
                </option>
              ))}
            </select>
          </Field>
        ) : (
          <input type="hidden" value="student" {...register('role')} />
        )}
        {(viewerRole === 'coach' || role === 'student') && (
          <Field
            id="invite-player"
            label={viewerRole === 'coach' ? 'Player on your roster' : 'Player (optional)'}
            hint="The new student account sees this player’s sessions. Players who already have an account are not listed."
            error={errors.athleteId?.message}
          >
            <select id="invite-player" className={inputClass} aria-invalid={errors.athleteId ? true : undefined} {...register('athleteId')}>
              <option value="">{viewerRole === 'coach' ? 'Choose a player…' : 'No player yet'}</option>
              {open.map((p) => (
                <option key={p.id} value={String(p.id)}>
                  {p.displayName}
                </option>
              ))}
            </select>
          </Field>
        )}
        <div className="flex items-end sm:col-span-2">
          <Button type="submit" className="min-h-11" disabled={isSubmitting}>
            {isSubmitting ? 'Sending…' : 'Send invitation'}
          </Button>
        </div>
        {viewerRole === 'coach' && (
          <p className="text-sm text-ink-muted sm:col-span-2">
            For a player under 18, invite them only with a parent’s or guardian’s consent, as your academy’s and local rules require.
          </p>
        )}
      </form>
      {formError && (
        <p role="alert" className="text-sm font-medium text-danger">
          {formError}
        </p>
      )}
      <p role="status" className="text-sm text-ink" data-testid="invite-status">
        {status}
      </p>

      <section aria-labelledby="pending-heading">
        <h2 id="pending-heading" className="mb-2 text-base font-semibold">
          Waiting for an answer
        </h2>
        {invitations.length === 0 ? (
          <p className="text-sm text-ink-muted">No open invitations.</p>
        ) : (
          <ul className="divide-y divide-surface-line text-sm" data-testid="pending-invitations">
            {invitations.map((i) => (
              <li key={i.id} className="flex flex-wrap items-center justify-between gap-3 py-2.5">
                <span>
                  <span className="font-medium">{i.email}</span> · {roleLabels[i.role]}
                  {i.athleteName ? ` for ${i.athleteName}` : ''}
                  <span className="block text-ink-muted">
                    Sent {formatDate(i.sentAt.slice(0, 10))}
                    {i.invitedBy ? ` by ${i.invitedBy}` : ''} · {i.expired ? 'link expired' : `link works until ${formatDate(i.expiresAt.slice(0, 10))}`}
                  </span>
                </span>
                <span className="flex items-center gap-2">
                  {i.expired && <Badge tone="danger">Expired</Badge>}
                  <Button type="button" variant="secondary" className="min-h-11" onClick={() => void resend(i)} aria-label={`Send the invitation to ${i.email} again`}>
                    Send again
                  </Button>
                  <Button type="button" variant="danger" className="min-h-11" onClick={() => void withdraw(i)} aria-label={`Withdraw the invitation to ${i.email}`}>
                    Withdraw
                  </Button>
                </span>
              </li>
            ))}
          </ul>
        )}
      </section>
    </div>
  );
}
