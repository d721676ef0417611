'use client';
// The two sets' mean lead % curves on the 0-100 % swing axis with their bands (mean ± k SD), when the API sends them.
// Set A solid, set B dashed: the line style tells them apart as well as the colour.
import { area, line, scaleLinear } from 'd3';
import { CHART_COLOURS } from '@/components/charts/lib/palette';

// null where no swing of the set had a value (JSON has no NaN); the lines break there
type Curve = { mean: (number | null)[]; lower: (number | null)[]; upper: (number | null)[] };
const W = 640;
const H = 220;
const M = { left: 40, right: 12, top: 10, bottom: 28 };

export function MeanCurves({ a, b }: { a: { label: string; axis: number[]; curve: Curve } | null; b: { label: string; axis: number[]; curve: Curve } | null }) {
  const sets = [a && { ...a, colour: CHART_COLOURS.lead, dash: undefined }, b && { ...b, colour: CHART_COLOURS.trail, dash: '6 4' }].filter((s) => s != null);
  if (sets.length === 0) return <p className="text-sm text-ink-muted">No mean curves for these sets.</p>;
  const x = scaleLinear().domain([0, 100]).range([M.left, W - M.right]);
  const y = scaleLinear().domain([0, 100]).range([H - M.bottom, M.top]);
  return (
    <figure data-chart="compare-mean-curves">
      <svg viewBox={`0 0 ${W} ${H}`} className="w-full max-w-[44rem]" role="img" aria-label="Mean lead % over the swing for both sets, with their bands">
        {y.ticks(5).map((t) => (
          <g key={t}>
            <line x1={M.left} x2={W - M.right} y1={y(t)} y2={y(t)} stroke={CHART_COLOURS.line} />
            <text x={M.left - 6} y={y(t) + 3} textAnchor="end" fontSize={10} fill={CHART_COLOURS.inkMuted}>{t}</text>
          </g>
        ))}
        {x.ticks(5).map((t) => (
          <text key={t} x={x(t)} y={H - M.bottom + 14} textAnchor="middle" fontSize={10} fill={CHART_COLOURS.inkMuted}>{t} %</text>
        ))}
        {sets.map((s) => {
          const pts = s.axis.map((p, i) => ({ p, m: s.curve.mean[i], lo: s.curve.lower[i], hi: s.curve.upper[i] }));
          const band = area<(typeof pts)[number]>().defined((d) => d.lo !== null && d.hi !== null).x((d) => x(d.p)).y0((d) => y(d.lo ?? 0)).y1((d) => y(d.hi ?? 0))(pts) ?? '';
          const mean = line<(typeof pts)[number]>().defined((d) => d.m !== null).x((d) => x(d.p)).y((d) => y(d.m ?? 0))(pts) ?? '';
          return (
            <g key={s.label}>
              <path d={band} fill={s.colour} opacity={0.12} />
              <path d={mean} fill="none" stroke={s.colour} strokeWidth={2} strokeDasharray={s.dash} />
            </g>
          );
        })}
      </svg>
      <figcaption className="flex gap-4 text-sm text-ink-muted">
        {sets.map((s) => (
          <span key={s.label} className="inline-flex items-center gap-1">
            <svg width="24" height="8" aria-hidden><line x1="0" x2="24" y1="4" y2="4" stroke={s.colour} strokeWidth="2" strokeDasharray={s.dash} /></svg>
            {s.label}: mean lead % (shaded: band)
          </span>
        ))}
        <span>x: swing from address (0 %) to finish (100 %)</span>
      </figcaption>
    </figure>
  );
}
