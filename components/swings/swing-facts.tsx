// The swing's headline numbers in one compact strip: tempo, lead % at impact and where the impact time came from.
import { formatTempo, impactSourceLabels } from '@/components/recordings/format';
import type { SwingDetail } from '@/lib/contracts/swings';

function Fact({ label, value, testId }: { label: string; value: string; testId?: string }) {
  return (
    <div className="flex items-baseline gap-2">
      <dt className="text-xs font-medium uppercase tracking-wide text-ink-muted">{label}</dt>
      <dd className="text-base font-semibold tabular-nums text-ink" data-testid={testId}>
        {value}
      </dd>
    </div>
  );
}

export function SwingFacts({ swing }: { swing: SwingDetail }) {
  const impact = swing.events.find((e) => e.name === 'impact');
  const leadAtImpact = impact?.leadPct;
  // A hand-moved impact is the coach's own time, whatever first found it.
  const impactFrom = impact?.source === 'manual' ? 'Set by hand' : impactSourceLabels[swing.impactSource];
  return (
    <dl className="flex flex-wrap items-baseline gap-x-8 gap-y-1 rounded-lg border border-surface-line bg-surface px-4 py-2.5">
      <Fact label="Tempo (backswing : downswing)" value={formatTempo(swing.tempoRatio)} testId="swing-tempo" />
      <Fact label="Lead % at impact" value={leadAtImpact == null ? '—' : `${leadAtImpact.toFixed(1)} %`} testId="swing-lead-at-impact" />
      <Fact label="Impact time from" value={impactFrom} testId="swing-impact-source" />
    </dl>
  );
}
