// Values at the cursor and at each event, one compact row each. No hooks: server-renderable (print summary).
import { EVENT_NAMES, type EventName } from '@/lib/signal/types';
import { formatNumber, formatSeconds } from './format';
import { nearestIndex } from './lib/nearest';
import type { SwingEvents, TraceSeries } from './lib/types';

export interface ValuesPanelProps {
  series: TraceSeries;
  events: SwingEvents;
  cursorTime?: number | null;
  corrected?: Partial<Record<EventName, boolean>>;
  timeZero?: number;
  className?: string;
}

// Short headings so the panel fits the side column of a tablet; the units are spelled out in the caption line.
const COLUMNS = [
  { key: 'leadPct', label: 'lead %', title: 'lead foot share of the total force, %', digits: 0 },
  { key: 'leadHeelPct', label: 'lead heel %', title: 'heel share of the lead foot, %', digits: 0 },
  { key: 'trailHeelPct', label: 'trail heel %', title: 'heel share of the trail foot, %', digits: 0 },
  { key: 'copX', label: 'COP x', title: 'COP toward the target, mm', digits: 0 },
  { key: 'copY', label: 'COP y', title: 'COP toward the toes, mm', digits: 0 },
  { key: 'copSpeed', label: 'COP speed', title: 'COP speed, mm/s', digits: 0 },
] as const;

function Row({ head, sub, subTone, t, series, zero, mark }: { head: string; sub?: string; subTone?: 'notice' | 'neutral'; t: number; series: TraceSeries; zero: number; mark?: boolean }) {
  const i = series.time.length ? nearestIndex(series.time, t) : -1;
  return (
    <tr className={`border-t border-surface-line ${mark ? 'bg-surface-sunken font-medium' : ''}`} data-values-row={head}>
      <th scope="row" className="whitespace-nowrap py-0.5 pr-1 text-left font-medium text-ink">
        {head}
        {sub && (
          <span className={`block w-fit rounded px-1 text-[9.5px] font-normal ${subTone === 'notice' ? 'bg-notice-soft text-notice' : 'bg-surface-line/60 text-ink-muted'}`}>{sub}</span>
        )}
      </th>
      <td className="px-1 py-0.5">{formatSeconds(t - zero)}</td>
      {COLUMNS.map((c) => (
        <td key={c.key} className="px-1 py-0.5">
          {i >= 0 ? formatNumber(series[c.key][i], c.digits) : '–'}
        </td>
      ))}
    </tr>
  );
}

export function ValuesPanel(p: ValuesPanelProps) {
  const zero = p.timeZero ?? 0;
  const cursor = p.cursorTime != null && Number.isFinite(p.cursorTime) ? p.cursorTime : null;
  return (
    // focusable: at 14 px on a tablet the table can scroll sideways, and a keyboard user must reach it (axe scrollable-region-focusable)
    <div className={`overflow-x-auto focus-visible:outline-2 ${p.className ?? ''}`} tabIndex={0} role="region" aria-label="Values at the cursor and at each event">
      <table className="w-full border-collapse text-right text-sm leading-tight tabular-nums text-ink-muted" data-values-panel>
        <caption className="pb-1 text-left text-sm text-ink-faint">Values at the cursor and at each event · time in s · COP in mm, speed in mm/s</caption>
        <thead>
          <tr className="text-ink-faint">
            <th scope="col" className="py-0.5 pr-1 text-left align-bottom font-medium">
              at
            </th>
            <th scope="col" className="px-1 py-0.5 align-bottom font-medium">
              time
            </th>
            {COLUMNS.map((c) => (
              <th key={c.key} scope="col" title={c.title} className="px-1 py-0.5 align-bottom text-sm font-medium leading-tight">
                {c.label}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {cursor != null && <Row head="cursor" t={cursor} series={p.series} zero={zero} mark />}
          {EVENT_NAMES.map((n) => (
            <Row key={n} head={n} sub={p.corrected?.[n] ? 'corrected' : undefined} subTone="notice" t={p.events[n]} series={p.series} zero={zero} />
          ))}
        </tbody>
      </table>
    </div>
  );
}
