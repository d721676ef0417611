'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import useSWR from 'swr';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Field, inputClass } from '@/components/ui/field';
import { roleLabels } from '@/components/ui/format';
import { fetchJson, sendJson } from '@/lib/fetcher';
import { applyServerErrors } from '@/lib/forms';
import { userListResponseSchema, userResponseSchema, type AcademyUser } from '@/lib/contracts/users';
import { createUserSchema, roleValues, type CreateUserInput, type Role } from '@/lib/contracts/users';

const fetchUsers = fetchJson(userListResponseSchema);

function CreateUserForm({ onCreated }: { onCreated: () => void }) {
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    reset,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<CreateUserInput>({ resolver: zodResolver(createUserSchema), defaultValues: { role: 'coach' } });

  async function onSubmit(values: CreateUserInput) {
    setFormError(null);
    try {
      await sendJson('/api/users', 'POST', values, userResponseSchema);
      reset({ email: '', name: '', password: '', role: 'coach' });
      onCreated();
    } catch (error) {
      setFormError(applyServerErrors(error, setError, { fields: ['email', 'name', 'role', 'password'], fallback: 'Could not create the account.' }));
    }
  }

  return (
    <form onSubmit={handleSubmit(onSubmit)} noValidate className="grid gap-4 sm:grid-cols-2">
      {formError && (
        <p role="alert" className="sm:col-span-2 rounded-md border border-danger/30 bg-danger-soft px-3 py-2 text-sm text-danger">
          {formError}
        </p>
      )}
      <Field id="new-name" label="Name" error={errors.name?.message}>
        <input id="new-name" className={inputClass} aria-invalid={Boolean(errors.name)} {...register('name')} />
      </Field>
      <Field id="new-email" label="Email" error={errors.email?.message}>
        <input id="new-email" type="email" className={inputClass} aria-invalid={Boolean(errors.email)} {...register('email')} />
      </Field>
      <Field id="new-role" label="Role" error={errors.role?.message}>
        <select id="new-role" className={inputClass} {...register('role')}>
          {roleValues.map((r) => (
            <option key={r} value={r}>
              {roleLabels[r]}
            </option>
          ))}
        </select>
      </Field>
      <Field id="new-password" label="First password" hint="At least 12 characters; share it privately." error={errors.password?.message}>
        <input id="new-password" type="password" autoComplete="new-password" className={inputClass} aria-invalid={Boolean(errors.password)} {...register('password')} />
      </Field>
      <div className="sm:col-span-2">
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? 'Creating…' : 'Create account'}
        </Button>
      </div>
    </form>
  );
}

function UserRow({ user, isSelf, onChanged }: { user: AcademyUser; isSelf: boolean; onChanged: () => void }) {
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function patch(body: { role?: Role; active?: boolean }) {
    setBusy(true);
    setError(null);
    try {
      await sendJson(`/api/users/${user.id}`, 'PATCH', body, userResponseSchema);
      onChanged();
    } catch (e) {
      setError(e instanceof Error ? e.message : 'Could not save.');
    } finally {
      setBusy(false);
    }
  }

  return (
    <tr className={user.active ? '' : 'text-ink-faint'}>
      <td className="py-2.5 pr-4 font-medium">{user.name}{isSelf && <span className="ml-2 text-sm text-ink-muted">(you)</span>}</td>
      <td className="py-2.5 pr-4 text-ink-muted">{user.email}</td>
      <td className="py-2.5 pr-4">
        <label className="sr-only" htmlFor={`role-${user.id}`}>Role of {user.name}</label>
        <select
          id={`role-${user.id}`}
          value={user.role}
          disabled={isSelf || busy}
          onChange={(e) => void patch({ role: e.target.value as Role })}
          className={`${inputClass} py-1`}
        >
          {roleValues.map((r) => (
            <option key={r} value={r}>
              {roleLabels[r]}
            </option>
          ))}
        </select>
      </td>
      <td className="py-2.5 pr-4">{user.active ? <Badge tone="ok">Active</Badge> : <Badge>Deactivated</Badge>}</td>
      <td className="py-2.5 text-right">
        {!isSelf && (
          <Button variant={user.active ? 'danger' : 'secondary'} disabled={busy} onClick={() => void patch({ active: !user.active })}>
            {user.active ? 'Deactivate' : 'Reactivate'}
          </Button>
        )}
        {error && <p role="alert" className="mt-1 text-sm text-danger">{error}</p>}
      </td>
    </tr>
  );
}

export function UserAdmin({ initial, selfId }: { initial: AcademyUser[]; selfId: number }) {
  const { data, error, mutate } = useSWR('/api/users', fetchUsers, { fallbackData: { users: initial } });
  const refresh = () => void mutate();
  return (
    <div className="space-y-8">
      {error && <p role="alert" className="text-sm text-danger">Could not load accounts: {(error as Error).message}</p>}
      <div className="overflow-x-auto">
        <table className="w-full text-left text-sm" data-testid="user-table">
          <thead className="border-b border-surface-line text-sm uppercase tracking-wide text-ink-muted">
            <tr>
              <th scope="col" className="py-2 pr-4 font-medium">Name</th>
              <th scope="col" className="py-2 pr-4 font-medium">Email</th>
              <th scope="col" className="py-2 pr-4 font-medium">Role</th>
              <th scope="col" className="py-2 pr-4 font-medium">Status</th>
              <th scope="col" className="py-2 font-medium"><span className="sr-only">Actions</span></th>
            </tr>
          </thead>
          <tbody className="divide-y divide-surface-line">
            {(data?.users ?? []).map((u) => (
              <UserRow key={u.id} user={u} isSelf={u.id === selfId} onChanged={refresh} />
            ))}
          </tbody>
        </table>
      </div>
      <section>
        <h2 className="mb-3 text-base font-semibold">New account</h2>
        <CreateUserForm onCreated={refresh} />
      </section>
    </div>
  );
}
