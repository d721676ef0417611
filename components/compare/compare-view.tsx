'use client';
// Two sets of one athlete's swings side by side (GET /api/athletes/:id/compare): a strip plot per chosen metric,
// the difference of means with its 95 % Welch interval, and the mean lead % curves with their bands.
import { useState } from 'react';
import useSWR from 'swr';
import { inputClass } from '@/components/ui/field';
import { fetchJson } from '@/lib/fetcher';
import { compareResponseSchema, type CompareResponse } from '@/lib/contracts/compare';
import { MeanCurves } from './mean-curves';
import { metricLabel } from './metrics';
import { MetricPicker } from './metric-picker';
import { StripPlot } from './strip-plot';

const fetchCompare = fetchJson(compareResponseSchema);
const fmt = (v: number | null | undefined, d = 2) => (v == null || !Number.isFinite(v) ? '—' : v.toFixed(d));
const monthLabel = (m: string) => new Intl.DateTimeFormat('en-GB', { month: 'long', year: 'numeric', timeZone: 'UTC' }).format(new Date(`${m}-01T00:00:00Z`));

const CONTEXT_SETS = [
  { value: 'context:practice', label: 'Practice sessions' },
  { value: 'context:on-course', label: 'On-course sessions' },
  { value: 'context:lesson', label: 'Lessons' },
];

/** The sets on offer: only contexts and months that hold swings. */
export function setOptions(contexts: string[], months: string[]) {
  return [...CONTEXT_SETS.filter((o) => contexts.includes(o.value.slice('context:'.length))), ...months.map((m) => ({ value: `month:${m}`, label: monthLabel(m) }))];
}

/** Practice vs on-course when both hold swings; else the two newest months; else the first two sets on offer. */
export function defaultSets(contexts: string[], months: string[]): [string, string] {
  if (contexts.includes('practice') && contexts.includes('on-course')) return ['context:practice', 'context:on-course'];
  if (months.length >= 2) return [`month:${months[0]}`, `month:${months[1]}`];
  const all = setOptions(contexts, months).map((o) => o.value);
  return [all[0] ?? 'context:practice', all[1] ?? 'context:on-course'];
}

function curveOf(set: CompareResponse['a']) {
  const mc = set.meanCurve;
  const c = mc?.curves.leadPct;
  if (!mc || !c) return null;
  return { label: set.label, axis: mc.axis, curve: c };
}

export function CompareView({ athleteId, contexts, months }: { athleteId: number; contexts: string[]; months: string[] }) {
  const options = setOptions(contexts, months);
  const [initialA, initialB] = defaultSets(contexts, months);
  const [a, setA] = useState(initialA);
  const [b, setB] = useState(initialB);
  const [metrics, setMetrics] = useState<string[]>(['impact.leadPct', 'tempoRatio']);
  const url = metrics.length && a !== b ? `/api/athletes/${athleteId}/compare?a=${encodeURIComponent(a)}&b=${encodeURIComponent(b)}&metrics=${metrics.map(encodeURIComponent).join(',')}` : null;
  const { data, error, isLoading } = useSWR(url, fetchCompare, { revalidateOnFocus: false, keepPreviousData: true });

  return (
    <div className="space-y-5" data-testid="compare-view">
      <div className="flex flex-wrap gap-4">
        <label className="text-sm"><span className="block text-sm text-ink-muted">Set A (circles, solid)</span>
          <select aria-label="Set A" className={`${inputClass} w-auto`} value={a} onChange={(e) => setA(e.target.value)}>{options.map((o) => <option key={o.value} value={o.value}>{o.label}</option>)}</select>
        </label>
        <label className="text-sm"><span className="block text-sm text-ink-muted">Set B (triangles, dashed)</span>
          <select aria-label="Set B" className={`${inputClass} w-auto`} value={b} onChange={(e) => setB(e.target.value)}>{options.map((o) => <option key={o.value} value={o.value}>{o.label}</option>)}</select>
        </label>
        <MetricPicker metrics={metrics} onChange={setMetrics} className="text-sm" listClassName="max-w-2xl" />
      </div>
      {options.length < 2 && <p className="text-sm text-ink-muted">Comparing needs swings in two sets (two kinds of session, or two months).</p>}
      {a === b && options.length >= 2 && <p className="text-sm text-ink-muted">Choose two different sets.</p>}
      {metrics.length === 0 && <p className="text-sm text-ink-muted">Tick at least one metric.</p>}
      {error && <p role="alert" className="text-sm text-danger">Could not compare: {error instanceof Error ? error.message : ''}</p>}
      {isLoading && !data && <p className="text-sm text-ink-muted">Comparing…</p>}
      {data && url && <CompareResult data={data} />}
    </div>
  );
}

function CompareResult({ data }: { data: CompareResponse }) {
  const few = [data.a, data.b].filter((s) => s.n < 3);
  return (
    <div className="space-y-5">
      {few.length > 0 && (
        <p role="note" className="rounded-md border border-notice-line bg-notice-soft px-4 py-3 text-sm text-notice" data-testid="too-few">
          {few.map((s) => `${s.label} has ${s.n} swing${s.n === 1 ? '' : 's'}`).join('; ')}: too few swings to say anything about a difference. Record more before reading these numbers.
        </p>
      )}
      <p className="text-sm text-ink-muted">A = {data.a.label} (circles), B = {data.b.label} (triangles); the black bar is the set’s mean.</p>
      <div className="grid gap-4 xl:grid-cols-2">
        {data.differences.map((d) => (
          <StripPlot key={d.metric} metric={d.metric} label={metricLabel(d.metric)} a={{ label: data.a.label, values: data.a.values[d.metric] ?? [] }} b={{ label: data.b.label, values: data.b.values[d.metric] ?? [] }} />
        ))}
      </div>
      <table className="w-full text-left text-sm" data-testid="compare-differences">
        <thead className="text-ink-muted">
          <tr><th className="py-1 font-medium">Metric</th><th className="py-1 text-right font-medium">Average A</th><th className="py-1 text-right font-medium">Average B</th><th className="py-1 text-right font-medium">B − A</th><th className="py-1 text-right font-medium"><abbr title="Welch’s t interval, 95 % (unequal variances)" className="no-underline">Likely range of the change</abbr></th><th className="py-1 pl-3 font-medium">Note</th></tr>
        </thead>
        <tbody>
          {data.differences.map((d) => (
            <tr key={d.metric} className="border-t border-surface-line">
              <td className="py-1.5">{metricLabel(d.metric)}</td>
              <td className="py-1.5 text-right tabular-nums">{fmt(d.meanA)}</td>
              <td className="py-1.5 text-right tabular-nums">{fmt(d.meanB)}</td>
              <td className="py-1.5 text-right tabular-nums">{fmt(d.diff)}</td>
              <td className="py-1.5 text-right tabular-nums">{d.ci95 ? `${fmt(d.ci95[0])} to ${fmt(d.ci95[1])}` : '—'}</td>
              <td className="py-1.5 pl-3 text-sm text-ink-muted">{d.note ?? (d.ci95 && d.ci95[0] <= 0 && d.ci95[1] >= 0 ? 'the interval includes 0: no clear difference' : '')}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="text-sm text-ink-muted">
        How much B differs from A, and the range the true change most likely lies in (95 % of the time). When the range
        holds 0, the two sets may not really differ. Swings of one player are not fully independent, so read it as a
        guide. <span className="text-ink-faint">(Exact: difference of means with Welch’s t interval, unequal variances.)</span>
      </p>
      {(curveOf(data.a) || curveOf(data.b)) && <MeanCurves a={curveOf(data.a)} b={curveOf(data.b)} />}
    </div>
  );
}
