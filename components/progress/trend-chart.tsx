'use client';
// One metric across sessions: the session mean with ± 1 SD whiskers, a marker shape per session context (lesson
// square, practice circle, on course triangle) and the context's initial beside it, so the context never rests on
// colour alone. D3 computes the scales; React draws the SVG.
import { line, scaleLinear, scaleTime } from 'd3';
import { CHART_COLOURS } from '@/components/charts/lib/palette';

export type TrendPoint = { date: string; context: string; mean: number | null; sd: number | null; n: number };
const W = 560;
const H = 170;
const M = { left: 44, right: 14, top: 12, bottom: 30 };

const initial: Record<string, string> = { lesson: 'L', practice: 'P', 'on-course': 'C' };

export function ContextMark({ context, x, y }: { context: string; x: number; y: number }) {
  const s = 4.5;
  if (context === 'lesson') return <rect x={x - s} y={y - s} width={2 * s} height={2 * s} fill={CHART_COLOURS.surface} stroke={CHART_COLOURS.ink} strokeWidth={1.5} />;
  if (context === 'on-course') return <path d={`M${x},${y - s - 1}l${s + 1},${2 * s + 1}h${-2 * s - 2}z`} fill={CHART_COLOURS.surface} stroke={CHART_COLOURS.ink} strokeWidth={1.5} />;
  return <circle cx={x} cy={y} r={s} fill={CHART_COLOURS.surface} stroke={CHART_COLOURS.ink} strokeWidth={1.5} />;
}

export function TrendChart({ label, points, yDomain }: { label: string; points: TrendPoint[]; yDomain?: [number, number] }) {
  const pts = points.filter((p): p is TrendPoint & { mean: number } => p.mean != null && Number.isFinite(p.mean));
  if (pts.length === 0) return <p className="text-sm text-ink-muted">{label}: no values yet.</p>;
  const dates = pts.map((p) => new Date(`${p.date.slice(0, 10)}T00:00:00Z`));
  const t0 = Math.min(...dates.map(Number));
  const t1 = Math.max(...dates.map(Number));
  const x = scaleTime().domain(t0 === t1 ? [t0 - 86_400_000 * 3, t1 + 86_400_000 * 3] : [t0, t1]).range([M.left + 8, W - M.right - 8]);
  const lo = Math.min(...pts.map((p) => p.mean - (p.sd ?? 0)));
  const hi = Math.max(...pts.map((p) => p.mean + (p.sd ?? 0)));
  const y = scaleLinear().domain(yDomain ?? (lo === hi ? [lo - 1, hi + 1] : [lo, hi])).nice().range([H - M.bottom, M.top]);
  const path = line<number>().x((i) => x(dates[i])).y((i) => y(pts[i].mean))(pts.map((_, i) => i)) ?? '';
  const fmtDate = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', timeZone: 'UTC' });
  return (
    <figure data-chart="progress-trend">
      <figcaption className="text-sm font-medium text-ink">{label}</figcaption>
      <svg viewBox={`0 0 ${W} ${H}`} className="w-full max-w-[36rem]" role="img" aria-label={`${label} across ${pts.length} sessions`}>
        {y.ticks(4).map((t) => (
          <g key={t}>
            <line x1={M.left} x2={W - M.right} y1={y(t)} y2={y(t)} stroke={CHART_COLOURS.line} />
            <text x={M.left - 6} y={y(t) + 3} textAnchor="end" fontSize={10} fill={CHART_COLOURS.inkMuted}>{t}</text>
          </g>
        ))}
        {x.ticks(Math.min(6, pts.length)).map((t) => (
          <text key={+t} x={x(t)} y={H - M.bottom + 16} textAnchor="middle" fontSize={10} fill={CHART_COLOURS.inkMuted}>{fmtDate.format(t)}</text>
        ))}
        <path d={path} fill="none" stroke={CHART_COLOURS.accent} strokeWidth={1.5} />
        {pts.map((p, i) => {
          const cx = x(dates[i]);
          return (
            <g key={i} data-session-context={p.context}>
              {p.sd != null && p.sd > 0 && <line x1={cx} x2={cx} y1={y(p.mean - p.sd)} y2={y(p.mean + p.sd)} stroke={CHART_COLOURS.inkFaint} />}
              <ContextMark context={p.context} x={cx} y={y(p.mean)} />
              <text x={cx + 7} y={y(p.mean) - 6} fontSize={9} fill={CHART_COLOURS.inkMuted}>{initial[p.context] ?? '?'}</text>
              <title>{`${p.date.slice(0, 10)} · ${p.context} · mean ${p.mean.toFixed(2)}${p.sd != null ? ` ± ${p.sd.toFixed(2)}` : ''} (n=${p.n})`}</title>
            </g>
          );
        })}
      </svg>
    </figure>
  );
}

export function ContextKey() {
  return (
    <p className="flex flex-wrap items-center gap-4 text-sm text-ink-muted">
      {(['lesson', 'practice', 'on-course'] as const).map((c) => (
        <span key={c} className="inline-flex items-center gap-1">
          <svg width="14" height="14" aria-hidden><ContextMark context={c} x={7} y={7.5} /></svg>
          {initial[c]} = {c === 'on-course' ? 'on course' : c}
        </span>
      ))}
      <span title="± 1 standard deviation (SD) of the session’s swings">whiskers: the typical spread of the session’s swings</span>
    </p>
  );
}
