import type { Metadata } from 'next';
import Link from 'next/link';
import { ResetConfirmForm } from '@/components/accounts/reset-confirm-form';
import { resetLinkUsable } from '@/lib/accounts/password-reset';

export const metadata: Metadata = { title: 'Choose a new password' };
export const dynamic = 'force-dynamic';

export default async function ResetPasswordTokenPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  if (!(await resetLinkUsable(token))) {
    return (
      <>
        <h1 className="mb-2 text-lg font-semibold">This link does not work</h1>
        <p className="mb-4 text-sm text-ink-muted" data-testid="reset-invalid">
          Links to choose a new password work once and for one hour. Ask for a new one.
        </p>
        <Link href="/reset-password" className="inline-flex min-h-11 items-center text-sm font-medium text-accent underline">
          Ask for a new link
        </Link>
      </>
    );
  }
  return (
    <>
      <h1 className="mb-1 text-lg font-semibold">Choose a new password</h1>
      <p className="mb-5 text-sm text-ink-muted">Saving it signs your account out everywhere else.</p>
      <ResetConfirmForm token={token} />
    </>
  );
}
