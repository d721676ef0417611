import Link from 'next/link';
import type { ColumnDef, FilterFn } from '@tanstack/react-table';
import { Badge } from '@/components/ui/badge';
import { formatNumber, formatTempo } from '@/components/recordings/format';
import { ScoreCell } from '@/components/targets/score-cell';

export type SwingRow = {
  id: number;
  /** 1..N over the whole session in time order */
  number: number;
  index: number;
  recordingId: number;
  filename: string;
  /** the coach's labels from the viewer: club, and strike · flight · tags · rating as one line */
  club: string | null;
  label: string | null;
  impactS: number | null;
  leadPctAtImpact: number | null;
  tempoRatio: number | null;
  /** 'manual' when the coach moved impact by hand */
  impactSource: 'marker' | 'detected' | 'manual';
  stale: boolean;
  /** a pitch or half swing: smaller weight shift than the golfer's full swings */
  partial?: boolean;
};

export type NumberRange = [number | undefined, number | undefined];

/** [min, max] with either end open; a swing without the value never matches a bounded filter. */
export const numberRange: FilterFn<SwingRow> = (row, columnId, value: NumberRange) => {
  const [min, max] = value;
  if (min === undefined && max === undefined) return true;
  const v = row.getValue<number | undefined>(columnId);
  if (v === undefined) return false;
  return (min === undefined || v >= min) && (max === undefined || v <= max);
};

/** Case-insensitive "contains"; an empty cell never matches a non-empty filter. */
export const containsText: FilterFn<SwingRow> = (row, columnId, value: string) => {
  const v = row.getValue<string | undefined>(columnId);
  return v !== undefined && v.toLowerCase().includes(value.toLowerCase());
};

export const sameRecording: FilterFn<SwingRow> = (row, columnId, value: number) => row.getValue<number>(columnId) === value;

const dash = <span className="text-ink-faint">—</span>;

export const swingColumns: ColumnDef<SwingRow>[] = [
  {
    id: 'swing',
    header: 'Swing',
    accessorFn: (r) => r.number,
    cell: ({ row }) => (
      <span className="inline-flex items-center gap-2">
        <Link href={`/swings/${row.original.id}`} className="font-medium text-accent hover:underline">
          Swing {row.original.number}
        </Link>
        {row.original.stale && <Badge tone="notice">Kept: manual corrections</Badge>}
        {row.original.partial && <Badge tone="neutral">Partial</Badge>}
      </span>
    ),
  },
  { id: 'recording', header: 'Recording', accessorFn: (r) => r.recordingId, filterFn: sameRecording, cell: ({ row }) => <span title={`swing ${row.original.index} of this file`}>{row.original.filename} · {row.original.index}</span>, sortingFn: (a, b) => a.original.filename.localeCompare(b.original.filename) || a.original.index - b.original.index },
  { id: 'club', header: 'Club', accessorFn: (r) => r.club ?? undefined, filterFn: containsText, sortUndefined: 'last', cell: ({ getValue }) => getValue<string | undefined>() ?? dash },
  { id: 'label', header: 'Label', accessorFn: (r) => r.label ?? undefined, filterFn: containsText, sortUndefined: 'last', cell: ({ getValue }) => getValue<string | undefined>() ?? dash },
  { id: 'impact', header: 'Impact (s)', accessorFn: (r) => r.impactS ?? undefined, sortUndefined: 'last', enableColumnFilter: false, cell: ({ getValue }) => formatNumber(getValue<number | undefined>(), 3) },
  { id: 'leadPct', header: 'Lead % at impact', accessorFn: (r) => r.leadPctAtImpact ?? undefined, filterFn: numberRange, sortUndefined: 'last', cell: ({ getValue }) => formatNumber(getValue<number | undefined>(), 1, ' %') },
  { id: 'tempo', header: 'Tempo', accessorFn: (r) => r.tempoRatio ?? undefined, filterFn: numberRange, sortUndefined: 'last', cell: ({ getValue }) => formatTempo(getValue<number | undefined>()) },
  { id: 'targetScore', header: 'Target checks', accessorFn: (r) => r.id, enableSorting: false, enableColumnFilter: false, cell: ({ row }) => <ScoreCell swingId={row.original.id} /> },
  { id: 'impactSource', header: 'Impact from', accessorFn: (r) => r.impactSource, enableColumnFilter: false, cell: ({ getValue }) => ({ marker: 'Marker', detected: 'Pressure', manual: 'By hand' })[getValue<'marker' | 'detected' | 'manual'>()] },
];
