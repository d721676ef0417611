// Who moved which event, from where to where and when (newest first, as the API sends them).
import { eventLabels } from './labels';
import type { SwingView } from '@/lib/contracts/swings';

export function CorrectionLog({ corrections, timeZero }: { corrections: SwingView['corrections']; timeZero: number }) {
  return (
    <ul className="space-y-1 text-sm text-ink" data-testid="correction-log">
      {corrections.map((c, i) => (
        <li key={`${c.at}-${c.event}-${i}`} className="tabular-nums">
          {eventLabels[c.event]}: {(c.fromS - timeZero).toFixed(2)} s → {(c.toS - timeZero).toFixed(2)} s{c.kind === 'reset' ? ' (reset to automatic)' : ''}{' '}
          <span className="text-ink-muted">
            by {c.byName}, {new Date(c.at).toLocaleString()}
          </span>
        </li>
      ))}
    </ul>
  );
}
