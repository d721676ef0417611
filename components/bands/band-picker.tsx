'use client';
// Choose a reference band to overlay on the lead % chart of this swing (the bands the caller can see).
import { inputClass } from '@/components/ui/field';
import { useBandList } from './band-overlay';

export function BandPicker({ value, onChange, loading }: { value: number | null; onChange: (id: number | null) => void; loading?: boolean }) {
  const { data, error } = useBandList();
  const bands = data?.bands ?? [];
  return (
    <label className="flex items-center gap-2 text-sm text-ink">
      <span className="whitespace-nowrap">Reference band</span>
      <select
        aria-label="Reference band"
        className={`${inputClass} w-auto`}
        value={value ?? ''}
        onChange={(e) => onChange(e.target.value === '' ? null : Number(e.target.value))}
        disabled={!data}
      >
        <option value="">None</option>
        {bands.map((b) => (
          <option key={b.id} value={b.id}>
            {b.name} ({b.swingCount} swings, typical range ×{b.k})
          </option>
        ))}
      </select>
      {loading && <span className="text-sm text-ink-muted">loading…</span>}
      {error != null && <span className="text-sm text-danger">bands unavailable</span>}
    </label>
  );
}
