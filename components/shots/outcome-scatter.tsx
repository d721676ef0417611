'use client';
// One pressure measure (x) against one shot result (y): a point per paired shot, a link to its swing, and the least
// squares line. D3 computes the scales; React draws the SVG.
import { scaleLinear } from 'd3';
import Link from 'next/link';
import { CHART_COLOURS } from '@/components/charts/lib/palette';

const W = 560;
const H = 300;
const M = { left: 56, right: 16, top: 14, bottom: 44 };

export interface ScatterProps {
  xLabel: string;
  yLabel: string;
  points: { swingId: number; x: number; y: number }[];
  slope: number | null;
  intercept: number | null;
}

export function OutcomeScatter({ xLabel, yLabel, points, slope, intercept }: ScatterProps) {
  if (points.length === 0) return <p className="text-sm text-ink-muted">No paired shots with both values yet.</p>;
  const pad = (lo: number, hi: number): [number, number] => (lo === hi ? [lo - 1, hi + 1] : [lo, hi]);
  const x = scaleLinear().domain(pad(Math.min(...points.map((p) => p.x)), Math.max(...points.map((p) => p.x)))).nice().range([M.left, W - M.right]);
  const y = scaleLinear().domain(pad(Math.min(...points.map((p) => p.y)), Math.max(...points.map((p) => p.y)))).nice().range([H - M.bottom, M.top]);
  const [x0, x1] = x.domain();
  const line = slope !== null && intercept !== null ? { x1: x(x0), y1: y(intercept + slope * x0), x2: x(x1), y2: y(intercept + slope * x1) } : null;
  return (
    <figure data-chart="outcome-scatter">
      <svg viewBox={`0 0 ${W} ${H}`} className="w-full max-w-[40rem]" role="img" aria-label={`${yLabel} against ${xLabel}, ${points.length} shots`}>
        <clipPath id="scatter-plot-area">
          <rect x={M.left} y={M.top} width={W - M.left - M.right} height={H - M.top - M.bottom} />
        </clipPath>
        {y.ticks(5).map((t) => (
          <g key={`y${t}`}>
            <line x1={M.left} x2={W - M.right} y1={y(t)} y2={y(t)} stroke={CHART_COLOURS.line} />
            <text x={M.left - 6} y={y(t)} dy="0.32em" textAnchor="end" fontSize={12} fill={CHART_COLOURS.inkMuted}>
              {t}
            </text>
          </g>
        ))}
        {x.ticks(6).map((t) => (
          <text key={`x${t}`} x={x(t)} y={H - M.bottom + 16} textAnchor="middle" fontSize={12} fill={CHART_COLOURS.inkMuted}>
            {t}
          </text>
        ))}
        <text x={(M.left + W - M.right) / 2} y={H - 6} textAnchor="middle" fontSize={13} fill={CHART_COLOURS.ink}>
          {xLabel}
        </text>
        <text transform={`translate(14 ${(M.top + H - M.bottom) / 2}) rotate(-90)`} textAnchor="middle" fontSize={13} fill={CHART_COLOURS.ink}>
          {yLabel}
        </text>
        {line && <line {...line} stroke={CHART_COLOURS.accent} strokeWidth={2} strokeDasharray="6 4" clipPath="url(#scatter-plot-area)" data-testid="fitted-line" />}
        {points.map((p, i) => (
          <Link key={`${p.swingId}-${i}`} href={`/swings/${p.swingId}`} aria-label={`Open swing: ${xLabel} ${p.x.toFixed(1)}, ${yLabel} ${p.y.toFixed(1)}`} data-testid="scatter-point">
            {/* a 44 px target around a small mark */}
            <circle cx={x(p.x)} cy={y(p.y)} r={11} fill="transparent" />
            <circle cx={x(p.x)} cy={y(p.y)} r={5} fill={CHART_COLOURS.surface} stroke={CHART_COLOURS.ink} strokeWidth={1.75} />
          </Link>
        ))}
      </svg>
      <figcaption className="mt-1 text-sm text-ink-muted">Each circle is one shot; select it to open its swing. Dashed: the least squares line.</figcaption>
    </figure>
  );
}
