// What each phase means in plain words, for the student (our own wording; the times come from the events
// that bound the phase).
import { phaseLabels } from './labels';
import type { SwingDetail } from '@/lib/contracts/swings';

export const phaseExplanations: Record<keyof typeof phaseLabels, string> = {
  backswing:
    'From standing still over the ball until the club reaches its highest point behind you. Pressure usually drifts toward the trail foot as you wind up.',
  transition:
    'The short moment where the body stops winding up and starts unwinding. Pressure starts heading back toward the lead foot, often before the club has turned around.',
  downswing:
    'From the change of direction until the club meets the ball. This is where pressure moves most quickly onto the lead foot.',
  'follow-through':
    'From contact until you hold your balanced finish. Most of your weight ends up on the lead foot, with the trail foot resting on its toes.',
};

export function PhaseExplainer({ phases }: { phases: SwingDetail['phases'] }) {
  return (
    <dl className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4" data-testid="phase-explainer">
      {(Object.keys(phaseLabels) as (keyof typeof phaseLabels)[]).map((name) => {
        const duration = phases.find((p) => p.name === name)?.durationS;
        return (
          <div key={name} className="rounded-md border border-surface-line p-3">
            <dt className="text-sm font-semibold text-ink">
              {phaseLabels[name].name}{' '}
              <span className="text-sm font-normal text-ink-muted">
                {phaseLabels[name].span}
                {duration != null ? ` · ${duration.toFixed(2)} s in this swing` : ''}
              </span>
            </dt>
            <dd className="mt-1 text-sm text-ink-muted">{phaseExplanations[name]}</dd>
          </div>
        );
      })}
    </dl>
  );
}
