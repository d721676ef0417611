import type { ReactNode } from 'react';

export const inputClass =
  'block w-full rounded-md border border-surface-line bg-surface px-3 py-2 text-sm text-ink placeholder:text-ink-faint focus:border-accent aria-[invalid=true]:border-danger';

/** Label, control, hint and error for one form field; the error is linked to the control for screen readers. */
export function Field({
  id,
  label,
  hint,
  error,
  children,
}: {
  id: string;
  label: string;
  hint?: string;
  error?: string;
  children: ReactNode;
}) {
  return (
    <div className="space-y-1.5">
      <label htmlFor={id} className="block text-sm font-medium text-ink">
        {label}
      </label>
      {children}
      {hint && !error && (
        <p id={`${id}-hint`} className="text-sm text-ink-muted">
          {hint}
        </p>
      )}
      {error && (
        <p id={`${id}-error`} role="alert" className="text-sm font-medium text-danger" data-field-error={id}>
          {error}
        </p>
      )}
    </div>
  );
}
