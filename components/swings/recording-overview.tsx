'use client';
// The whole recording at low resolution (lead % over time) with this swing's window marked. A click inside the
// window moves the viewer's cursor there; a click before or after it opens the previous or next swing.
import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { scaleLinear } from 'd3';
import type { MouseEvent } from 'react';
import { CHART_COLOURS, TONE_STYLE } from '@/components/charts/lib/palette';
import { linePath } from '@/components/charts/lib/paths';
import type { SwingView } from '@/lib/contracts/swings';

const W = 1000;
const H = 40;

export interface RecordingOverviewProps {
  overview: SwingView['overview'];
  siblings: SwingView['siblings'];
  window: { startS: number; endS: number };
  onJump: (t: number) => void;
}

export function RecordingOverview({ overview, siblings, window: win, onJump }: RecordingOverviewProps) {
  const router = useRouter();
  const time = overview.time;
  const t0 = time[0] ?? win.startS;
  const t1 = time[time.length - 1] ?? win.endS;
  const x = scaleLinear().domain([t0, t1 > t0 ? t1 : t0 + 1]).range([0, W]);
  const y = scaleLinear().domain([0, 100]).range([H - 4, 4]);
  const lead = Float64Array.from(overview.leadPct, (v) => (v === null ? NaN : v));
  const path = time.length > 1 ? linePath(time, lead, x, y) : '';

  const onClick = (e: MouseEvent<SVGSVGElement>) => {
    const box = e.currentTarget.getBoundingClientRect();
    const t = x.invert(((e.clientX - box.left) / box.width) * W);
    if (t < win.startS && siblings.previousId !== null) router.push(`/swings/${siblings.previousId}`);
    else if (t > win.endS && siblings.nextId !== null) router.push(`/swings/${siblings.nextId}`);
    else onJump(Math.min(win.endS, Math.max(win.startS, t)));
  };

  const link = 'rounded-md border border-surface-line px-2.5 py-1 text-xs text-ink hover:bg-surface-sunken';
  return (
    <section aria-label="Recording overview" className="rounded-lg border border-surface-line bg-surface px-3 py-2" data-testid="recording-overview">
      <div className="mb-1 flex items-center gap-3 text-xs text-ink-muted">
        <span className="font-medium text-ink">Whole recording</span>
        <span>lead % over {(t1 - t0).toFixed(0)} s · this swing shaded · click before or after it for the neighbouring swing</span>
        <span className="ml-auto flex gap-2">
          {siblings.previousId !== null ? (
            <Link href={`/swings/${siblings.previousId}`} className={link} data-testid="previous-swing">
              ← Previous swing
            </Link>
          ) : (
            <span className={`${link} text-ink-faint`}>← Previous swing</span>
          )}
          {siblings.nextId !== null ? (
            <Link href={`/swings/${siblings.nextId}`} className={link} data-testid="next-swing">
              Next swing →
            </Link>
          ) : (
            <span className={`${link} text-ink-faint`}>Next swing →</span>
          )}
        </span>
      </div>
      <svg viewBox={`0 0 ${W} ${H}`} preserveAspectRatio="none" className="block h-10 w-full cursor-pointer" onClick={onClick} role="img" aria-label={`Lead % across the recording; this swing from ${win.startS.toFixed(2)} to ${win.endS.toFixed(2)} s`}>
        <rect x={x(win.startS)} y={0} width={Math.max(2, x(win.endS) - x(win.startS))} height={H} fill={CHART_COLOURS.bandSoft} stroke={CHART_COLOURS.bandEdge} vectorEffect="non-scaling-stroke" />
        <line x1={0} x2={W} y1={y(50)} y2={y(50)} stroke={CHART_COLOURS.line} vectorEffect="non-scaling-stroke" />
        <path d={path} fill="none" stroke={TONE_STYLE.lead.stroke} strokeWidth={1.25} vectorEffect="non-scaling-stroke" />
      </svg>
    </section>
  );
}
