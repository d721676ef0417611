'use client';

import Link from 'next/link';
import { signOut } from 'next-auth/react';
import { useState } from 'react';
import { Button } from '@/components/ui/button';

export function SignOutPanel() {
  const [pending, setPending] = useState(false);
  return (
    <div className="flex items-center gap-3">
      <Button
        type="button"
        disabled={pending}
        onClick={() => {
          setPending(true);
          void signOut({ callbackUrl: '/sign-in' });
        }}
      >
        {pending ? 'Signing out…' : 'Sign out'}
      </Button>
      <Link href="/" className="text-sm font-medium text-ink-muted hover:text-ink">
        Stay signed in
      </Link>
    </div>
  );
}
