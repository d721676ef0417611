'use client';
// Per-athlete trends across sessions (GET /api/athletes/:id/progress): chosen metrics and the share of target checks
// passed, each session marked with its context.
import { useState } from 'react';
import useSWR from 'swr';
import { fetchJson } from '@/lib/fetcher';
import { progressResponseSchema } from '@/lib/contracts/compare';
import { MetricPicker } from '@/components/compare/metric-picker';
import { metricLabel } from '@/components/compare/metrics';
import { ContextKey, TrendChart } from './trend-chart';

const fetchProgress = fetchJson(progressResponseSchema);

export function ProgressView({ athleteId }: { athleteId: number }) {
  const [metrics, setMetrics] = useState<string[]>(['impact.leadPct', 'top.trailHeelPct', 'tempoRatio']);
  const url = `/api/athletes/${athleteId}/progress?metrics=${metrics.map(encodeURIComponent).join(',')}`;
  const { data, error } = useSWR(url, fetchProgress, { revalidateOnFocus: false, keepPreviousData: true });
  return (
    <div className="space-y-4" data-testid="progress-view">
      <MetricPicker metrics={metrics} onChange={setMetrics} />
      <ContextKey />
      {error && <p role="alert" className="text-sm text-danger">Could not load the progress: {error instanceof Error ? error.message : ''}</p>}
      {!data && !error && <p className="text-sm text-ink-muted">Loading…</p>}
      {data && data.sessions.length === 0 && <p className="text-sm text-ink-muted">No sessions with processed swings yet.</p>}
      {data && data.sessions.length > 0 && (
        <div className="grid gap-5 xl:grid-cols-2">
          <TrendChart
            label="Target checks passed (% of checks, session mean)"
            yDomain={[0, 100]}
            points={data.sessions.map((s) => ({ date: s.date, context: s.context, n: s.n, sd: null, mean: s.targetScore && s.targetScore.total > 0 ? (100 * s.targetScore.passed) / s.targetScore.total : null }))}
          />
          {metrics.map((m) => (
            <TrendChart key={m} label={metricLabel(m)} points={data.sessions.map((s) => ({ date: s.date, context: s.context, n: s.metrics[m]?.n ?? 0, mean: s.metrics[m]?.mean ?? null, sd: s.metrics[m]?.sd ?? null }))} />
          ))}
        </div>
      )}
    </div>
  );
}
