import Link from 'next/link';
import type { Metadata } from 'next';
import { SignInForm } from '@/components/auth/sign-in-form';
import { safeCallbackPath } from '@/lib/auth/callback-url';
import { describeSignInError } from '@/lib/auth/sign-in-errors';

export const metadata: Metadata = { title: 'Sign in' };
export const dynamic = 'force-dynamic';


export default async function SignInPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const params = await searchParams;
  const error = typeof params.error === 'string' ? describeSignInError(params.error) : null;
  return (
    <>
      <h1 className="mb-1 text-lg font-semibold">Sign in</h1>
      <p className="mb-5 text-sm text-ink-muted">Use the account your academy created for you.</p>
      <SignInForm callbackUrl={safeCallbackPath(params.callbackUrl)} initialError={error} />
      <p className="mt-4 text-sm">
        <Link href="/reset-password" className="inline-flex min-h-11 items-center text-accent underline">
          Forgotten your password?
        </Link>
      </p>
    </>
  );
}
