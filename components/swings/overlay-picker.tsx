'use client';
// Pick a second swing of the same athlete to draw over this one; it is fetched only when chosen.
import useSWR from 'swr';
import type { OverlayTrace } from '@/components/charts';
import { fetchJson } from '@/lib/fetcher';
import { swingUrl } from './swing-api';
import { swingViewResponseSchema, type SwingView } from '@/lib/contracts/swings';
import { eventRecord, traceSeries } from './swing-view-model';

const fetchSwing = fetchJson(swingViewResponseSchema);

/** The chosen swing as an overlay, or null while none is chosen or it is loading. */
export function useOverlay(id: number | null): { overlay: OverlayTrace | null; loading: boolean; error: unknown } {
  const { data, error, isLoading } = useSWR(id === null ? null : swingUrl(id), fetchSwing, { revalidateOnFocus: false });
  const events = data ? eventRecord(data.swing.events) : null;
  const overlay = data && events && data.swing.series.time.length > 1 ? { label: `Swing ${data.swing.index} (${data.swing.session.sessionDate})`, series: traceSeries(data.swing.series), events } : null;
  return { overlay, loading: isLoading, error };
}

export function OverlayPicker({ self, options, value, onChange, loading }: { self: number; options: SwingView['siblings']['sameAthlete']; value: number | null; onChange: (id: number | null) => void; loading: boolean }) {
  const list = options.filter((o) => o.id !== self);
  return (
    <label className="inline-flex items-center gap-1.5 text-xs text-ink-muted">
      Compare with
      <select
        value={value ?? ''}
        onChange={(e) => onChange(e.target.value ? Number(e.target.value) : null)}
        className="max-w-[14rem] rounded-md border border-surface-line bg-surface px-2 py-1 text-xs text-ink"
        data-testid="overlay-picker"
        disabled={list.length === 0}
      >
        <option value="">{list.length ? 'no second swing' : 'no other swings'}</option>
        {list.map((o) => (
          <option key={o.id} value={o.id}>
            {o.label}
          </option>
        ))}
      </select>
      {loading && <span aria-live="polite">loading…</span>}
    </label>
  );
}
