import type { Metadata } from 'next';
import Link from 'next/link';
import { AcceptInvitationForm } from '@/components/accounts/accept-invitation-form';
import { describeInvitation } from '@/lib/accounts/invitations';

export const metadata: Metadata = { title: 'Accept your invitation' };
export const dynamic = 'force-dynamic';

const ROLE_WORDS = { admin: 'an academy admin', coach: 'a coach', student: 'a student', researcher: 'a researcher' } as const;

export default async function InvitePage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const invitation = await describeInvitation(token);
  if (!invitation) {
    return (
      <>
        <h1 className="mb-2 text-lg font-semibold">This invitation link does not work</h1>
        <p className="mb-4 text-sm text-ink-muted" data-testid="invite-invalid">
          It may have been used already, have expired (links last 72 hours), have been withdrawn, or be copied incompletely. Ask the
          person who invited you to send a new one.
        </p>
        <Link href="/sign-in" className="inline-flex min-h-11 items-center text-sm font-medium text-accent underline">
          Go to sign-in
        </Link>
      </>
    );
  }
  const emailName = invitation.email.split('@')[0] ?? '';
  return (
    <>
      <h1 className="mb-1 text-lg font-semibold">{`Join ${invitation.academyName}`}</h1>
      <p className="mb-5 text-sm text-ink-muted">
        You are invited as {ROLE_WORDS[invitation.role]}
        {invitation.playerName ? `, for the player profile of ${invitation.playerName}` : ''}. Choose a password to create your account.
      </p>
      <AcceptInvitationForm token={token} email={invitation.email} defaultName={invitation.playerName ?? emailName} />
    </>
  );
}
