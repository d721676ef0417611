import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { AthleteOverview } from '@/components/athletes/athlete-overview';
import { buttonClass } from '@/components/ui/button';
import { PageHeader } from '@/components/ui/card';
import { requirePageRole } from '@/lib/auth/roles';
import { findAthleteForViewer } from '@/lib/db/athletes';
import { listSessionsForAthlete } from '@/lib/db/practice-sessions';
import { idParamSchema } from '@/lib/http';
import { SessionBin } from '@/components/sessions/session-bin';
import { AccountLinkForm } from '@/components/athletes/account-link-form';
import { linkedAccount } from '@/lib/athletes/account-link';
import { Card } from '@/components/ui/card';
import { ConsentPanel } from '@/components/research/consent-panel';
import { ArchiveAthlete } from '@/components/athletes/athlete-archive';

export const metadata: Metadata = { title: 'Athlete' };

export default async function AthletePage({ params, searchParams }: { params: Promise<{ id: string }>; searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const viewer = await requirePageRole('coach', 'student');
  const id = idParamSchema.safeParse((await params).id);
  if (!id.success) notFound();
  const athlete = await findAthleteForViewer(viewer, id.data);
  if (!athlete) notFound();
  const sessions = await listSessionsForAthlete(athlete.id);
  const binned = idParamSchema.safeParse((await searchParams).binned);
  const account = viewer.role === 'coach' ? await linkedAccount(athlete.id) : null;
  return (
    <>
      <PageHeader
        title={athlete.displayName}
        subtitle="Player profile"
        action={
          <div className="flex gap-2">
            <Link href={`/athletes/${athlete.id}/progress`} className={buttonClass('secondary')}>
              Progress
            </Link>
            <Link href={`/athletes/${athlete.id}/compare`} className={buttonClass('secondary')}>
              Compare sets
            </Link>
            <Link href={`/athletes/${athlete.id}/outcomes`} className={buttonClass('secondary')}>
              Shots and pressure
            </Link>
            {viewer.role === 'coach' && (
            <div className="flex gap-2">
              <Link href={`/upload?athlete=${athlete.id}`} className={buttonClass('primary')}>
                Upload recordings
              </Link>
              <Link href={`/athletes/${athlete.id}/edit`} className={buttonClass('secondary')}>
                Edit profile
              </Link>
            </div>
            )}
          </div>
        }
      />
      {viewer.role === 'coach' && athlete.archivedAt && (
        <div className="mb-4">
          <ArchiveAthlete athlete={athlete} />
        </div>
      )}
      {viewer.role === 'coach' && (
        <div className="mb-4">
          <SessionBin athleteId={athlete.id} justBinned={binned.success ? binned.data : null} />
        </div>
      )}
      <AthleteOverview athlete={athlete} sessions={sessions} />
      {viewer.role === 'coach' && (
        <div className="mt-6">
          <Card title="Student account">
            <AccountLinkForm athleteId={athlete.id} account={account} />
          </Card>
          {!athlete.archivedAt && (
            <div className="mt-6">
              <Card title="Archive">
                <ArchiveAthlete athlete={athlete} />
              </Card>
            </div>
          )}
        </div>
      )}
      <div className="mt-6">
        <Card title="Research consent">
          <ConsentPanel athleteId={athlete.id} self={viewer.role === 'student'} />
        </Card>
      </div>
    </>
  );
}
