import { Badge } from '@/components/ui/badge';
import { formatNumber } from '@/components/recordings/format';
import type { SwingDetail } from '@/lib/contracts/swings';
import { eventLabels } from './labels';

const th = 'py-2 pr-4 font-medium';
const td = 'py-2 pr-4';

/** The five events with their times and the values at them (lead %, heel % per foot, stance COP). */
export function EventTable({ events }: { events: SwingDetail['events'] }) {
  const zero = events.find((e) => e.name === 'address')?.timeS ?? 0;
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-left text-sm tabular-nums" data-testid="event-table">
        <thead className="border-b border-surface-line text-sm text-ink-muted">
          <tr>
            <th scope="col" className={th}>Event</th>
            <th scope="col" className={th}>From address (s)</th>
            <th scope="col" className={`${th} text-ink-faint`} title="Seconds on the recording's own clock">Recording time (s)</th>
            <th scope="col" className={th}>Lead %</th>
            <th scope="col" className={th}>Lead heel %</th>
            <th scope="col" className={th}>Trail heel %</th>
            <th scope="col" className={th}>COP X (mm)</th>
            <th scope="col" className={th}>COP Y (mm)</th>
            <th scope="col" className={th}>Source</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-surface-line">
          {events.map((e) => (
            <tr key={e.name} data-event={e.name}>
              <th scope="row" className={`${td} font-medium`}>{eventLabels[e.name]}</th>
              <td className={td}>{formatNumber(e.timeS - zero, 2)}</td>
              <td className={`${td} text-ink-muted`}>{formatNumber(e.timeS, 3)}</td>
              <td className={td}>{formatNumber(e.leadPct, 1)}</td>
              <td className={td}>{formatNumber(e.leadHeelPct, 1)}</td>
              <td className={td}>{formatNumber(e.trailHeelPct, 1)}</td>
              <td className={td}>{formatNumber(e.copXMm, 1)}</td>
              <td className={td}>{formatNumber(e.copYMm, 1)}</td>
              <td className={td}>
                {e.source === 'manual' ? (
                  <span className="inline-flex items-center gap-1.5">
                    <Badge tone="band">Manual</Badge>
                    {e.misfit && <Badge tone="notice">Out of order after reprocessing</Badge>}
                  </span>
                ) : (
                  <span className="text-ink-muted">Automatic</span>
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
