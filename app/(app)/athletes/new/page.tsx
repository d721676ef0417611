import type { Metadata } from 'next';
import { AthleteForm } from '@/components/athletes/athlete-form';
import { Card, PageHeader } from '@/components/ui/card';
import { requirePageRole } from '@/lib/auth/roles';

export const metadata: Metadata = { title: 'Add athlete' };

export default async function NewAthletePage() {
  await requirePageRole('coach');
  return (
    <>
      <PageHeader title="Add athlete" subtitle="The athlete joins your roster." />
      <Card className="max-w-2xl">
        <AthleteForm />
      </Card>
    </>
  );
}
