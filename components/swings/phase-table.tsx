import { formatNumber } from '@/components/recordings/format';
import type { SwingDetail } from '@/lib/contracts/swings';
import { phaseLabels } from './labels';

const th = 'py-2 pr-4 font-medium';
const td = 'py-2 pr-4';

/** Phases x (duration, COP path, peak COP speed, mean lead %), as lib/signal/phases.ts computes them. */
export function PhaseTable({ phases }: { phases: SwingDetail['phases'] }) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-left text-sm tabular-nums" data-testid="phase-table">
        <thead className="border-b border-surface-line text-sm text-ink-muted">
          <tr>
            <th scope="col" className={th}>Phase</th>
            <th scope="col" className={th}>Duration (s)</th>
            <th scope="col" className={th}>COP path (mm)</th>
            <th scope="col" className={th}>Peak COP speed (mm/s)</th>
            <th scope="col" className={th}>Mean lead %</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-surface-line">
          {phases.map((p) => (
            <tr key={p.name} data-phase={p.name}>
              <th scope="row" className={`${td} font-medium`}>
                {phaseLabels[p.name].name} <span className="text-sm font-normal text-ink-muted">{phaseLabels[p.name].span}</span>
              </th>
              <td className={td}>{formatNumber(p.durationS, 3)}</td>
              <td className={td}>{formatNumber(p.copPathMm, 1)}</td>
              <td className={td}>{formatNumber(p.peakCopSpeedMmS, 0)}</td>
              <td className={td}>{formatNumber(p.meanLeadPct, 1)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
