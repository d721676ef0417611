// One drill as the coach and the student read it: steps, the checks it works on, and what to watch for in this drill.
// The general caution is the page's one compact line (CoachingCaution); the card carries only the drill's own words,
// as plain text, so the yellow notice is not repeated in every card.
import type { ReactNode } from 'react';
import { type Drill } from '@/lib/contracts/drills';
import { eventLabels, measureLabels } from '@/lib/contracts/targets';

export function DrillBody({ drill }: { drill: Partial<Drill> }) {
  return (
    <div className="space-y-2 text-sm">
      {drill.steps && drill.steps.length > 0 && (
        <ol className="list-decimal space-y-0.5 pl-5">
          {drill.steps.map((s, i) => <li key={i}>{s}</li>)}
        </ol>
      )}
      {drill.addressesChecks && drill.addressesChecks.length > 0 && (
        <p className="text-sm text-ink-muted">Works on: {drill.addressesChecks.map((c) => `${measureLabels[c.measure]} at ${eventLabels[c.event].toLowerCase()}`).join('; ')}</p>
      )}
      {drill.cautions && (
        <p className="text-sm text-ink" data-testid="drill-caution">
          <span className="font-semibold">Watch for: </span>{drill.cautions}
        </p>
      )}
    </div>
  );
}

export function DrillCard({ drill, children }: { drill: Partial<Drill> & { name: string }; children?: ReactNode }) {
  return (
    <article className="rounded-md border border-surface-line p-4" data-drill={drill.name}>
      <h3 className="mb-2 font-semibold text-ink">{drill.name}</h3>
      <DrillBody drill={drill} />
      {children}
    </article>
  );
}
