'use client';
// The table behind a chart: every sample in view, for screen readers (always in the document, visually hidden) and
// for copying (a toggle shows it). Memoised on the arrays themselves, so moving the cursor does not rebuild it.
import { memo, useId, useState } from 'react';
import { formatNumber, formatSeconds } from './format';
import type { NumArray } from './lib/types';

export interface TableColumn {
  label: string;
  values: NumArray;
  digits?: number;
}

export interface ChartTableProps {
  caption: string;
  time: NumArray;
  columns: TableColumn[];
  /** inclusive sample-index range to list */
  range: [number, number];
  /** time labels are written relative to this (s) */
  timeZero?: number;
  /** rows where an event falls get its name */
  eventAt?: Record<number, string>;
  /** line up with the plot area of a time chart (left inset of the y axis); default true */
  inset?: boolean;
}

function sameProps(a: ChartTableProps, b: ChartTableProps): boolean {
  return (
    a.caption === b.caption &&
    a.time === b.time &&
    a.range[0] === b.range[0] &&
    a.range[1] === b.range[1] &&
    a.timeZero === b.timeZero &&
    a.inset === b.inset &&
    JSON.stringify(a.eventAt) === JSON.stringify(b.eventAt) &&
    a.columns.length === b.columns.length &&
    a.columns.every((c, i) => c.values === b.columns[i].values && c.label === b.columns[i].label && c.digits === b.columns[i].digits)
  );
}

function ChartTableInner(p: ChartTableProps) {
  const [shown, setShown] = useState(false);
  const id = useId();
  const rows: number[] = [];
  for (let i = Math.max(0, p.range[0]); i <= Math.min(p.time.length - 1, p.range[1]); i++) rows.push(i);
  const zero = p.timeZero ?? 0;
  return (
    <div className={p.inset === false ? 'px-3' : 'pl-10 pr-3'}>
      <button
        type="button"
        className="text-sm text-accent underline-offset-2 hover:underline"
        aria-expanded={shown}
        aria-controls={id}
        onClick={() => setShown((v) => !v)}
      >
        {shown ? 'Hide table' : 'Show table'}
      </button>
      {/* open, the table scrolls: a named region in the tab order, so it can be scrolled from the keyboard (WCAG 2.1.1) */}
      <div
        id={id}
        className={shown ? 'mt-1 max-h-48 overflow-auto rounded border border-surface-line' : 'sr-only'}
        tabIndex={shown ? 0 : undefined}
        role={shown ? 'region' : undefined}
        aria-label={shown ? p.caption : undefined}
      >
        <table className="w-auto min-w-[16rem] border-collapse text-right text-sm tabular-nums text-ink" data-chart-table>
          <caption className="sr-only">{p.caption}</caption>
          <thead className="sticky top-0 bg-surface-sunken text-ink-muted">
            <tr>
              <th scope="col" className="px-2 py-1 font-medium">
                time, s
              </th>
              <th scope="col" className="px-2 py-1 text-left font-medium">
                event
              </th>
              {p.columns.map((c) => (
                <th key={c.label} scope="col" className="px-2 py-1 font-medium">
                  {c.label}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {rows.map((i) => (
              <tr key={i} className="border-t border-surface-line">
                <td className="px-2 py-0.5">{formatSeconds(p.time[i] - zero, 3)}</td>
                <td className="px-2 py-0.5 text-left">{p.eventAt?.[i] ?? ''}</td>
                {p.columns.map((c) => (
                  <td key={c.label} className="px-2 py-0.5">
                    {formatNumber(c.values[i], c.digits ?? 1)}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}

export const ChartTable = memo(ChartTableInner, sameProps);
