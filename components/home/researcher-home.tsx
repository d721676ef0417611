import { Card, PageHeader } from '@/components/ui/card';

export function ResearcherHome() {
  return (
    <>
      <PageHeader title="Research workspace" subtitle="Tables across many golfers, with reproducible processing settings." />
      <Card title="What will appear here">
        <ul className="list-disc space-y-2 pl-5 text-sm text-ink">
          <li>Per-phase tables of pressure measures (address, top, impact, finish) across players and sessions.</li>
          <li>The processing parameters used for every number, so an analysis can be repeated exactly.</li>
          <li>Exports for your own statistics software.</li>
        </ul>
        <p className="mt-4 rounded-md border border-band/40 bg-band-soft px-3 py-2 text-sm text-ink">
          Only data from players who have given consent will appear, and only in de-identified form: no names,
          dates of birth or clubs. For players under 18, consent comes from a parent or guardian. Nothing personal is
          shown to researchers today.
        </p>
      </Card>
    </>
  );
}
