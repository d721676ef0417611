import type { Metadata } from 'next';
import { UserAdmin } from '@/components/admin/user-admin';
import { Card, PageHeader } from '@/components/ui/card';
import { requirePageRole } from '@/lib/auth/roles';
import { listAcademyUsers } from '@/lib/db/users';
import { AccountLinkForm } from '@/components/athletes/account-link-form';
import { listAcademyPlayers } from '@/lib/db/athletes';

export const metadata: Metadata = { title: 'Accounts' };

export default async function UsersPage() {
  const admin = await requirePageRole('admin');
  const users = await listAcademyUsers(admin.academyId);
  const players = await listAcademyPlayers(admin.academyId);
  return (
    <>
      <PageHeader title="Accounts" subtitle="Create accounts, change roles and deactivate accounts in your academy." />
      <Card>
        <UserAdmin initial={users} selfId={admin.id} />
      </Card>
      <div className="mt-6">
        <Card title="Link a student account to a player">
          <AccountLinkForm athletes={players} />
        </Card>
      </div>
    </>
  );
}
