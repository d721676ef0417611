import type { Metadata } from 'next';
import { BandBuilder } from '@/components/bands/band-builder';
import { BandList } from '@/components/bands/band-list';
import { swingChoicesFor } from '@/lib/bands/swing-choices';
import { Card, PageHeader } from '@/components/ui/card';
import { requirePageRole } from '@/lib/auth/roles';

export const metadata: Metadata = { title: 'Reference bands' };

// Coach only: build a reference band from chosen swings and list the bands at hand.
export default async function BandsPage() {
  const viewer = await requirePageRole('coach');
  const athletes = await swingChoicesFor(viewer);
  return (
    <>
      <PageHeader title="Reference bands" subtitle="A band is the typical range of chosen swings: their average, plus and minus a chosen number of typical spreads, lined up at address, top, transition, impact and finish." />
      <div className="space-y-6">
        <Card title="Build a band">
          <BandBuilder athletes={athletes} />
        </Card>
        <Card title="Bands">
          <BandList viewerId={viewer.id} />
        </Card>
      </div>
    </>
  );
}
