import { ResearchWorkbench } from '@/components/research/research-workbench';
import { PageHeader } from '@/components/ui/card';

export function ResearcherHome() {
  return (
    <>
      <PageHeader title="Research workspace" subtitle="Per-phase tables across consenting golfers, with the processing settings of every number." />
      <p className="mb-6 rounded-md border border-band/40 bg-band-soft px-3 py-2 text-sm text-ink">
        Only players who consented are here, and only de-identified: a code instead of a name, an age band instead of the date of
        birth, the week instead of the date; no clubs, places, notes or file names. Sessions a player had before the adult age also
        need a parent’s or guardian’s consent. Follow your ethics approval and local rules. Pressure patterns are coaching
        information, not a medical assessment.
      </p>
      <ResearchWorkbench />
    </>
  );
}
