import type { Metadata } from 'next';
import { SignOutPanel } from '@/components/auth/sign-out-panel';

export const metadata: Metadata = { title: 'Sign out' };

export default function SignOutPage() {
  return (
    <>
      <h1 className="mb-1 text-lg font-semibold">Sign out</h1>
      <p className="mb-5 text-sm text-ink-muted">End your session on this device.</p>
      <SignOutPanel />
    </>
  );
}
