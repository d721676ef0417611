'use client';

import { useMemo, useState } from 'react';
import {
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnFiltersState,
  type SortingState,
} from '@tanstack/react-table';
import { inputClass } from '@/components/ui/field';
import { swingColumns, type NumberRange, type SwingRow } from './swing-table-columns';

// Compact filter controls: the form input look without its full width.
const small = inputClass.replace('block w-full', 'block').replace('py-2', 'py-1.5');

/** '' -> undefined, '12.5' -> 12.5; anything not a number counts as no bound. */
const bound = (text: string): number | undefined => {
  if (text.trim() === '') return undefined;
  const n = Number(text);
  return Number.isFinite(n) ? n : undefined;
};

function RangeFilter({ label, id, value, onChange }: { label: string; id: string; value: [string, string]; onChange: (v: [string, string]) => void }) {
  return (
    <fieldset className="space-y-1">
      <legend className="text-sm font-medium text-ink-muted">{label}</legend>
      <div className="flex items-center gap-1.5">
        <input aria-label={`${label}, at least`} id={`${id}-min`} inputMode="decimal" placeholder="min" className={`${small} w-20`} value={value[0]} onChange={(e) => onChange([e.target.value, value[1]])} />
        <span className="text-ink-faint">–</span>
        <input aria-label={`${label}, at most`} id={`${id}-max`} inputMode="decimal" placeholder="max" className={`${small} w-20`} value={value[1]} onChange={(e) => onChange([value[0], e.target.value])} />
      </div>
    </fieldset>
  );
}

/** The swings of a session: sortable by every column, filterable by recording, club, label, lead % at impact and tempo. */
export function SwingTable({ rows, recordings }: { rows: SwingRow[]; recordings: { id: number; filename: string }[] }) {
  const [sorting, setSorting] = useState<SortingState>([{ id: 'recording', desc: false }]);
  const [recording, setRecording] = useState('');
  const [club, setClub] = useState('');
  const [label, setLabel] = useState('');
  const [lead, setLead] = useState<[string, string]>(['', '']);
  const [tempo, setTempo] = useState<[string, string]>(['', '']);
  const [hidePartial, setHidePartial] = useState(false);
  const data = useMemo(() => (hidePartial ? rows.filter((r) => !r.partial) : rows), [rows, hidePartial]);

  const columnFilters = useMemo<ColumnFiltersState>(() => {
    const f: ColumnFiltersState = [];
    if (recording) f.push({ id: 'recording', value: Number(recording) });
    if (club.trim()) f.push({ id: 'club', value: club.trim() });
    if (label.trim()) f.push({ id: 'label', value: label.trim() });
    const leadRange: NumberRange = [bound(lead[0]), bound(lead[1])];
    if (leadRange.some((v) => v !== undefined)) f.push({ id: 'leadPct', value: leadRange });
    const tempoRange: NumberRange = [bound(tempo[0]), bound(tempo[1])];
    if (tempoRange.some((v) => v !== undefined)) f.push({ id: 'tempo', value: tempoRange });
    return f;
  }, [recording, club, label, lead, tempo]);

  const table = useReactTable({
    data,
    columns: swingColumns,
    state: { sorting, columnFilters },
    onSortingChange: setSorting,
    sortDescFirst: false, // first click sorts ascending on every column, numbers included
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
  });

  const shown = table.getRowModel().rows;
  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-end gap-4" data-testid="swing-filters">
        <label className="space-y-1">
          <span className="block text-sm font-medium text-ink-muted">Recording</span>
          <select className={`${small} w-56`} value={recording} onChange={(e) => setRecording(e.target.value)} data-testid="filter-recording">
            <option value="">All recordings</option>
            {recordings.map((r) => (
              <option key={r.id} value={String(r.id)}>
                {r.filename}
              </option>
            ))}
          </select>
        </label>
        <label className="space-y-1">
          <span className="block text-sm font-medium text-ink-muted">Club</span>
          <input className={`${small} w-32`} value={club} onChange={(e) => setClub(e.target.value)} placeholder="any" />
        </label>
        <label className="space-y-1">
          <span className="block text-sm font-medium text-ink-muted">Label</span>
          <input className={`${small} w-32`} value={label} onChange={(e) => setLabel(e.target.value)} placeholder="any" />
        </label>
        <RangeFilter label="Lead % at impact" id="filter-lead" value={lead} onChange={setLead} />
        <RangeFilter label="Tempo (x : 1)" id="filter-tempo" value={tempo} onChange={setTempo} />
        <label className="inline-flex items-center gap-2 pb-1.5 text-sm" title="Partial swings: pitches and half swings, with a smaller weight shift than full swings">
          <input type="checkbox" checked={hidePartial} onChange={(e) => setHidePartial(e.target.checked)} data-testid="filter-hide-partial" />
          Hide partial swings
        </label>
      </div>
      <p className="text-sm text-ink-muted" data-testid="swing-count-shown">
        {shown.length === rows.length ? `${rows.length} swings` : `${shown.length} of ${rows.length} swings`}
      </p>
      <div className="overflow-x-auto">
        <table className="w-full text-left text-sm tabular-nums" data-testid="swing-table">
          <thead className="border-b border-surface-line text-sm text-ink-muted">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const sorted = header.column.getIsSorted();
                  return (
                    <th key={header.id} scope="col" className="py-2 pr-4 font-medium" aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : 'none'}>
                      <button type="button" onClick={header.column.getToggleSortingHandler()} className="inline-flex items-center gap-1 hover:text-ink">
                        {flexRender(header.column.columnDef.header, header.getContext())}
                        <span aria-hidden="true" className="w-3 text-ink-faint">
                          {sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : ''}
                        </span>
                      </button>
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody className="divide-y divide-surface-line">
            {shown.map((row) => (
              <tr key={row.id} className="hover:bg-surface-sunken/60" data-testid="swing-row">
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id} className="py-2 pr-4">
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
              </tr>
            ))}
            {shown.length === 0 && (
              <tr>
                <td colSpan={swingColumns.length} className="py-6 text-center text-sm text-ink-muted">
                  No swing matches these filters.
                </td>
              </tr>
            )}
          </tbody>
        </table>
      </div>
    </div>
  );
}
