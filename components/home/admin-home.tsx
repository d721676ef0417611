import Link from 'next/link';
import { Badge } from '@/components/ui/badge';
import { buttonClass } from '@/components/ui/button';
import { Card, PageHeader } from '@/components/ui/card';
import { roleLabels, rolePluralLabels } from '@/components/ui/format';
import type { Viewer } from '@/lib/auth/viewer';
import { listAcademyUsers } from '@/lib/db/users';
import { roleValues } from '@/lib/contracts/users';

export async function AdminHome({ viewer }: { viewer: Viewer }) {
  const users = await listAcademyUsers(viewer.academyId);
  return (
    <>
      <PageHeader title="Academy overview" subtitle={`Signed in as ${viewer.name}`} />
      <div className="mb-6 grid gap-4 sm:grid-cols-4">
        {roleValues.map((role) => (
          <div key={role} className="rounded-lg border border-surface-line bg-surface p-4">
            <p className="text-sm font-medium uppercase tracking-wide text-ink-muted">{rolePluralLabels[role]}</p>
            <p className="mt-1 text-2xl font-semibold tabular-nums">{users.filter((u) => u.role === role && u.active).length}</p>
          </div>
        ))}
      </div>
      <Card
        title="Accounts"
        action={
          <Link href="/users" className={buttonClass('secondary')}>
            Manage accounts
          </Link>
        }
      >
        <ul className="divide-y divide-surface-line text-sm">
          {users.map((u) => (
            <li key={u.id} className="flex items-center justify-between gap-4 py-2.5">
              <span>
                <span className="font-medium">{u.name}</span> <span className="text-ink-muted">{u.email}</span>
              </span>
              <span className="flex gap-2">
                <Badge>{roleLabels[u.role]}</Badge>
                {!u.active && <Badge tone="danger">Deactivated</Badge>}
              </span>
            </li>
          ))}
        </ul>
      </Card>
    </>
  );
}
