// Every button is at least 44 px high (min-h-11): a finger on a tablet in the bay hits it (WCAG 2.5.5 target size).
import type { ButtonHTMLAttributes } from 'react';

type Variant = 'primary' | 'secondary' | 'danger';

const variants: Record<Variant, string> = {
  primary: 'bg-accent text-white hover:bg-accent-strong disabled:bg-ink-faint',
  secondary: 'border border-surface-line bg-surface text-ink hover:bg-surface-sunken disabled:text-ink-faint',
  danger: 'border border-danger text-danger hover:bg-danger-soft disabled:opacity-50',
};

export const buttonClass = (variant: Variant = 'primary') =>
  `inline-flex min-h-11 items-center justify-center gap-2 rounded-md px-3.5 py-2 text-sm font-medium transition-colors disabled:cursor-not-allowed ${variants[variant]}`;

export function Button({
  variant = 'primary',
  className = '',
  ...props
}: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant }) {
  return <button className={`${buttonClass(variant)} ${className}`} {...props} />;
}
