'use client';
// For one session: the drills assigned before it and whether the checks they work on moved, session mean before the
// assignment against this session (GET /api/sessions/:id/drill-report).
import useSWR from 'swr';
import { fetchJson } from '@/lib/fetcher';
import { drillReportSchema } from '@/lib/contracts/drills';
import { eventLabels, measureLabels, type Measure, type TargetEvent } from '@/lib/contracts/targets';

const fetchReport = fetchJson(drillReportSchema);
const fmt = (v: number | null | undefined) => (v == null || !Number.isFinite(v) ? '—' : v.toFixed(1));
const label = (event: string, measure: string) => `${measureLabels[measure as Measure] ?? measure} at ${(eventLabels[event as TargetEvent] ?? event).toLowerCase()}`;

export function DrillReport({ sessionId }: { sessionId: number }) {
  const { data, error } = useSWR(`/api/sessions/${sessionId}/drill-report`, fetchReport, { revalidateOnFocus: false });
  if (error) return <p className="text-sm text-ink-muted">The drill report is not available: {error instanceof Error ? error.message : ''}</p>;
  if (!data) return <p className="text-sm text-ink-muted">Loading…</p>;
  if (data.assignments.length === 0) return <p className="text-sm text-ink-muted">No drill was assigned before this session.</p>;
  return (
    <div className="space-y-4" data-testid="drill-report">
      {data.assignments.map((a, i) => (
        <div key={i}>
          <p className="text-sm font-medium text-ink">{a.drill.name}</p>
          <table className="mt-1 w-full text-left text-sm">
            <thead className="text-sm text-ink-muted">
              <tr><th className="py-1 font-medium">Check</th><th className="py-1 text-right font-medium">Before (mean, n)</th><th className="py-1 text-right font-medium">This session</th><th className="py-1 text-right font-medium">Moved</th></tr>
            </thead>
            <tbody>
              {a.checks.map((c) => (
                <tr key={`${c.event}.${c.measure}`} className="border-t border-surface-line">
                  <td className="py-1">{label(c.event, c.measure)}</td>
                  <td className="py-1 text-right tabular-nums">{c.before ? `${fmt(c.before.mean)} (${c.before.n})` : '—'}</td>
                  <td className="py-1 text-right tabular-nums">{c.after ? `${fmt(c.after.mean)} (${c.after.n})` : '—'}</td>
                  <td className="py-1 text-right tabular-nums">{c.moved == null ? 'not enough swings' : `${c.moved > 0 ? '+' : ''}${fmt(c.moved)}`}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ))}
      <p className="text-sm text-ink-muted">Moved = this session’s mean minus the mean before the drill was given; a few swings move by chance, so look for a change that lasts.</p>
    </div>
  );
}
