// The swing's headline numbers in one compact strip: tempo, lead % at impact, where the impact time came from, the
// forward press before the takeaway, and whether it is a partial swing or one the coach counted.
import { formatTempo, impactSourceLabels } from '@/components/recordings/format';
import type { SwingDetail } from '@/lib/contracts/swings';

function Fact({ label, value, testId }: { label: string; value: string; testId?: string }) {
  return (
    <div className="flex items-baseline gap-2">
      <dt className="text-sm font-medium uppercase tracking-wide text-ink-muted">{label}</dt>
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
  const address = swing.events.find((e) => e.name === 'address')?.timeS;
  const press = swing.forwardPress;
  const pressText = press ? `${press.sizeMm.toFixed(0)} mm toward the lead foot${address === undefined ? '' : `, ${(address - press.timeS).toFixed(2)} s before the takeaway`}` : 'none';
  return (
    <dl className="flex flex-wrap items-baseline gap-x-8 gap-y-1 rounded-lg border border-surface-line bg-surface px-4 py-2.5">
      <Fact label="Tempo (backswing : downswing)" value={formatTempo(swing.tempoRatio)} testId="swing-tempo" />
      <Fact label="Lead % at impact" value={leadAtImpact == null ? '—' : `${leadAtImpact.toFixed(1)} %`} testId="swing-lead-at-impact" />
      <Fact label="Impact time from" value={impactFrom} testId="swing-impact-source" />
      {/* forward press: a small shift of the weight toward the lead foot as part of the set-up, before the takeaway */}
      {swing.forwardPress !== undefined && <Fact label="Forward press" value={pressText} testId="swing-forward-press" />}
      {swing.partial && <Fact label="Size" value="partial swing" testId="swing-partial" />}
      {swing.promoted && <Fact label="Counted by" value={swing.promoted === 'placed' ? 'the coach (events placed, adjust them)' : 'the coach'} testId="swing-promoted" />}
    </dl>
  );
}
