import type { Metadata } from 'next';
import Link from 'next/link';
import { RosterBrowser } from '@/components/athletes/roster-browser';
import { ArchivedPlayers, ArchiveUndo } from '@/components/athletes/athlete-archive';
import { buttonClass } from '@/components/ui/button';
import { Card, PageHeader } from '@/components/ui/card';
import { requirePageRole } from '@/lib/auth/roles';
import { listAthletesForViewer } from '@/lib/db/athletes';
import { idParamSchema } from '@/lib/http';
import { athleteListQuerySchema, type AthleteListQuery } from '@/lib/contracts/athletes';

export const metadata: Metadata = { title: 'Roster' };

type SearchParams = Promise<Record<string, string | string[] | undefined>>;

export default async function RosterPage({ searchParams }: { searchParams: SearchParams }) {
  const viewer = await requirePageRole('coach');
  const raw = await searchParams;
  const one = (v: string | string[] | undefined) => (typeof v === 'string' && v !== '' ? v : undefined);
  const parsed = athleteListQuerySchema.safeParse({ q: one(raw.q), context: one(raw.context), handedness: one(raw.handedness) });
  const filters: AthleteListQuery = parsed.success ? parsed.data : {};
  const athletes = await listAthletesForViewer(viewer, filters);
  const justArchived = idParamSchema.safeParse(one(raw.archived));
  return (
    <>
      <PageHeader
        title="Roster"
        subtitle="Your athletes, with their most recent session."
        action={
          <Link href="/athletes/new" className={buttonClass('primary')}>
            Add athlete
          </Link>
        }
      />
      <ArchiveUndo justArchived={justArchived.success ? justArchived.data : null} />
      <Card>
        <RosterBrowser
          initial={athletes}
          initialFilters={{ q: filters.q ?? '', context: filters.context ?? '', handedness: filters.handedness ?? '' }}
        />
        <ArchivedPlayers justArchived={justArchived.success ? justArchived.data : null} />
      </Card>
    </>
  );
}
