'use client';
// Pick a second swing of the same athlete to draw over this one; it is fetched only when chosen.
import { useState } from 'react';
import useSWR from 'swr';
import type { OverlayTrace } from '@/components/charts';
import { fetchJson } from '@/lib/fetcher';
import { swingUrl } from './swing-api';
import { overlayOptionsResponseSchema, swingViewResponseSchema } from '@/lib/contracts/swings';
import { eventRecord, traceSeries } from './swing-view-model';

const fetchSwing = fetchJson(swingViewResponseSchema);
const fetchOptions = fetchJson(overlayOptionsResponseSchema);

/** The chosen swing as an overlay, or null while none is chosen or it is loading. */
export function useOverlay(id: number | null): { overlay: OverlayTrace | null; loading: boolean; error: unknown } {
  const { data, error, isLoading } = useSWR(id === null ? null : swingUrl(id), fetchSwing, { revalidateOnFocus: false });
  const events = data ? eventRecord(data.swing.events) : null;
  const overlay = data && events && data.swing.series.time.count > 1 ? { label: `Swing ${data.swing.index} (${data.swing.session.sessionDate})`, series: traceSeries(data.swing.series), events } : null;
  return { overlay, loading: isLoading, error };
}

/**
 * Grouped by session (newest first), swings in time order within each; a search box narrows the list by date, club,
 * number or file. The list is its own request (GET /api/swings/:id/overlay-options), made after the swing itself.
 */
export function OverlayPicker({ self, value, onChange, loading }: { self: number; value: number | null; onChange: (id: number | null) => void; loading: boolean }) {
  const [query, setQuery] = useState('');
  const { data } = useSWR(`${swingUrl(self)}/overlay-options`, fetchOptions, { revalidateOnFocus: false });
  const list = (data?.options ?? []).filter((o) => o.id !== self);
  const q = query.trim().toLowerCase();
  const shown = q ? list.filter((o) => `${o.group} ${o.label}`.toLowerCase().includes(q) || o.id === value) : list;
  const groups: { name: string; items: typeof list }[] = [];
  for (const o of shown) {
    const last = groups[groups.length - 1];
    if (last && last.name === o.group) last.items.push(o);
    else groups.push({ name: o.group, items: [o] });
  }
  return (
    <span className="inline-flex flex-wrap items-center gap-1.5 text-sm text-ink-muted">
      <label htmlFor="overlay-picker">Compare with</label>
      <input
        type="search"
        aria-label="Find a swing to compare with"
        title="Search by date, club, swing number or file"
        placeholder="find…"
        value={query}
        onChange={(e) => setQuery(e.target.value)}
        className="min-h-11 w-24 rounded-md border border-surface-line bg-surface px-2 text-sm text-ink"
        disabled={list.length === 0}
        data-testid="overlay-search"
      />
      <select
        id="overlay-picker"
        value={value ?? ''}
        onChange={(e) => onChange(e.target.value ? Number(e.target.value) : null)}
        className="min-h-11 max-w-[20rem] rounded-md border border-surface-line bg-surface px-2 text-sm text-ink"
        data-testid="overlay-picker"
        disabled={list.length === 0}
      >
        <option value="">{data === undefined ? 'loading the list…' : list.length ? (q ? `${shown.length} found` : 'no second swing') : 'no other swings'}</option>
        {groups.map((g) => (
          <optgroup key={g.name} label={g.name}>
            {g.items.map((o) => (
              <option key={o.id} value={o.id}>
                {o.label}
              </option>
            ))}
          </optgroup>
        ))}
      </select>
      {loading && <span aria-live="polite">loading…</span>}
    </span>
  );
}
