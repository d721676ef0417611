import type { Metadata } from 'next';
import { InvitationsPanel } from '@/components/accounts/invitations-panel';
import { Card, PageHeader } from '@/components/ui/card';
import { invitablePlayers, listPendingInvitations } from '@/lib/accounts/invitations';
import { requirePageRole } from '@/lib/auth/roles';

export const metadata: Metadata = { title: 'Invitations' };

export default async function InvitationsPage() {
  const viewer = await requirePageRole('admin', 'coach');
  const role = viewer.role === 'admin' ? 'admin' : 'coach';
  const [players, invitations] = await Promise.all([invitablePlayers(viewer), listPendingInvitations(viewer)]);
  return (
    <>
      <PageHeader
        title="Invitations"
        subtitle={
          role === 'admin'
            ? 'Invite people to your academy by e-mail. Each link works once, for 72 hours.'
            : 'Invite a player on your roster to see their own sessions. Each link works once, for 72 hours.'
        }
      />
      <Card>
        <InvitationsPanel viewerRole={role} players={players} initial={invitations} />
      </Card>
    </>
  );
}
