import type { Metadata } from 'next';
import Link from 'next/link';
import { ResetRequestForm } from '@/components/accounts/reset-request-form';

export const metadata: Metadata = { title: 'Forgotten password' };
export const dynamic = 'force-dynamic';

export default function ResetPasswordPage() {
  return (
    <>
      <h1 className="mb-1 text-lg font-semibold">Forgotten password</h1>
      <p className="mb-5 text-sm text-ink-muted">Enter your account’s e-mail address and we send you a link to choose a new password.</p>
      <ResetRequestForm />
      <p className="mt-4 text-sm">
        <Link href="/sign-in" className="inline-flex min-h-11 items-center text-accent underline">
          Back to sign-in
        </Link>
      </p>
    </>
  );
}
