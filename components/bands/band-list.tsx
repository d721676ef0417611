'use client';
// The bands the coach can use: their own and those shared in the academy.
import { formatDate } from '@/components/ui/format';
import { Badge } from '@/components/ui/badge';
import { useBandList } from './band-overlay';

export function BandList() {
  const { data, error } = useBandList();
  if (error) return <p role="alert" className="text-sm text-danger">Could not load the bands: {error instanceof Error ? error.message : ''}</p>;
  if (!data) return <p className="text-sm text-ink-muted">Loading…</p>;
  if (data.bands.length === 0) return <p className="text-sm text-ink-muted">No bands yet. Pick three or more swings above.</p>;
  return (
    <table className="w-full text-left text-sm" data-testid="band-list">
      <thead className="text-xs text-ink-muted">
        <tr><th className="py-1 font-medium">Name</th><th className="py-1 font-medium">Swings</th><th className="py-1 font-medium">Width</th><th className="py-1 font-medium">Made by</th><th className="py-1 font-medium">Built</th><th className="py-1 font-medium" /></tr>
      </thead>
      <tbody>
        {data.bands.map((b) => (
          <tr key={b.id} className="border-t border-surface-line">
            <td className="py-1.5 font-medium">{b.name}</td>
            <td className="py-1.5 tabular-nums">{b.swingCount}</td>
            <td className="py-1.5">± {b.k} SD</td>
            <td className="py-1.5">{b.ownerName ?? '—'}</td>
            <td className="py-1.5">{formatDate(b.createdAt.slice(0, 10))}</td>
            <td className="py-1.5">{b.shared && <Badge tone="band">Shared</Badge>}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
