'use client';
// Strip plot of one metric for two sets: every swing a mark (set A circles, set B triangles, so the sets differ in
// shape as well as colour), with each set's mean as a bar. D3 computes the scale; React draws the SVG.
import { scaleLinear } from 'd3';
import { CHART_COLOURS } from '@/components/charts/lib/palette';

const W = 520;
const H = 120;
const M = { left: 64, right: 16, top: 10, bottom: 28 };

const mean = (v: number[]) => (v.length ? v.reduce((a, b) => a + b, 0) / v.length : null);

/** deterministic vertical jitter so identical values stay visible (golden-ratio sequence, no randomness) */
const jitter = (i: number) => (((i * 0.618034) % 1) - 0.5) * 22;

export function StripPlot({ metric, label, a, b }: { metric: string; label: string; a: { label: string; values: number[] }; b: { label: string; values: number[] } }) {
  const all = [...a.values, ...b.values];
  if (all.length === 0) return <p className="text-sm text-ink-muted">{label}: no values in either set.</p>;
  let lo = Math.min(...all);
  let hi = Math.max(...all);
  if (lo === hi) { lo -= 1; hi += 1; }
  const x = scaleLinear().domain([lo, hi]).nice().range([M.left, W - M.right]);
  const rows = [
    { set: a, name: 'A', y: M.top + 22, shape: 'circle' as const, colour: CHART_COLOURS.lead },
    { set: b, name: 'B', y: M.top + 62, shape: 'triangle' as const, colour: CHART_COLOURS.trail },
  ];
  const ticks = x.ticks(6);
  return (
    <figure className="space-y-1" data-chart="compare-strip" data-metric={metric}>
      <figcaption className="text-sm font-medium text-ink">{label}</figcaption>
      <svg viewBox={`0 0 ${W} ${H}`} className="w-full max-w-[40rem]" role="img" aria-label={`${label}: ${a.label} ${a.values.length} swings, ${b.label} ${b.values.length} swings`}>
        {ticks.map((t) => (
          <g key={t} transform={`translate(${x(t)},0)`}>
            <line y1={M.top} y2={H - M.bottom} stroke={CHART_COLOURS.line} />
            <text y={H - M.bottom + 14} textAnchor="middle" fontSize={10} fill={CHART_COLOURS.inkMuted}>{t}</text>
          </g>
        ))}
        {rows.map(({ set, name, y, shape, colour }) => {
          const m = mean(set.values);
          return (
            <g key={set.label}>
              <text x={M.left - 8} y={y + 4} textAnchor="end" fontSize={11} fill={CHART_COLOURS.ink}>{name} (n={set.values.length})<title>{set.label}</title></text>
              {set.values.map((v, i) =>
                shape === 'circle' ? (
                  <circle key={i} cx={x(v)} cy={y + jitter(i) * 0.6} r={3.5} fill="none" stroke={colour} strokeWidth={1.5} />
                ) : (
                  <path key={i} d={`M${x(v)},${y + jitter(i) * 0.6 - 4}l4,7h-8z`} fill="none" stroke={colour} strokeWidth={1.5} />
                ),
              )}
              {m != null && <line x1={x(m)} x2={x(m)} y1={y - 14} y2={y + 14} stroke={CHART_COLOURS.ink} strokeWidth={2.5} data-mean={m} />}
            </g>
          );
        })}
      </svg>
    </figure>
  );
}
