import { MinorConsentNote } from '@/components/cautions/minor-consent-note';
import { formatDate, handednessLabels } from '@/components/ui/format';
import { isMinor } from '@/lib/contracts/athletes';
import type { AthleteSummary } from '@/lib/contracts/athletes';

// Lead foot depends on handedness: a right-handed golfer's lead foot is the left.
function leadFoot(handedness: AthleteSummary['handedness']): string {
  return handedness === 'right' ? 'left' : 'right';
}

export function AthleteProfile({ athlete }: { athlete: AthleteSummary }) {
  const lead = leadFoot(athlete.handedness);
  const trail = lead === 'left' ? 'right' : 'left';
  return (
    <div className="space-y-4">
      <dl className="grid gap-x-8 gap-y-3 text-sm sm:grid-cols-2">
        <div>
          <dt className="text-ink-muted">Plays</dt>
          <dd className="font-medium">{handednessLabels[athlete.handedness]}</dd>
        </div>
        <div>
          <dt className="text-ink-muted">Feet</dt>
          <dd className="flex items-center gap-3 font-medium">
            <span className="inline-flex items-center gap-1.5">
              <span aria-hidden="true" className="h-2.5 w-2.5 rounded-full bg-foot-lead" /> Lead: {lead}
            </span>
            <span className="inline-flex items-center gap-1.5">
              <span aria-hidden="true" className="h-2.5 w-2.5 rounded-full bg-foot-trail" /> Trail: {trail}
            </span>
          </dd>
        </div>
        <div>
          <dt className="text-ink-muted">Stance width</dt>
          <dd className="font-medium tabular-nums">{athlete.stanceWidthMm} mm</dd>
        </div>
        <div>
          <dt className="text-ink-muted">Home club</dt>
          <dd className="font-medium">{athlete.homeClub ?? '—'}</dd>
        </div>
        <div>
          <dt className="text-ink-muted">Date of birth</dt>
          <dd className="font-medium tabular-nums">{formatDate(athlete.dateOfBirth)}</dd>
        </div>
      </dl>
      {athlete.dateOfBirth && isMinor(athlete.dateOfBirth) && <MinorConsentNote dateOfBirth={athlete.dateOfBirth} />}
    </div>
  );
}
