// One or more lines on the shared time axis, with phase shading, event markers, an optional reference band, an
// optional compared-swing line and the cursor. No hooks: it renders on the server for static pages and inside the
// client viewer, which passes the pointer handlers.
import type { PointerEvent as ReactPointerEvent, KeyboardEvent as ReactKeyboardEvent } from 'react';
import type { EventName } from '@/lib/signal/types';
import { ChartLegend, type LegendItem } from './chart-legend';
import { CHART_COLOURS } from './lib/palette';
import { chartGeometry, FONT_PX } from './time-chart-geometry';
import { ChartLayers } from './time-chart-layers';
import type { EventDragHandlers, TimeSeriesChartProps } from './time-series-chart-props';

export type { EventDragHandlers, TimeSeriesChartProps };

export function TimeSeriesChart(p: TimeSeriesChartProps) {
  const { box, w, h, x } = chartGeometry(p);
  const clampX = (px: number) => Math.min(w, Math.max(0, px));

  const timeAt = (e: ReactPointerEvent<SVGSVGElement>) => {
    const rect = e.currentTarget.getBoundingClientRect();
    const px = ((e.clientX - rect.left) * p.width) / Math.max(1, rect.width) - box.margin.left;
    return x.invert(clampX(px));
  };
  const onPointerDown = (e: ReactPointerEvent<SVGSVGElement>) => {
    if (e.button !== 0) return;
    const target = e.target as Element;
    const marker = target.closest?.('[data-drag-event]')?.getAttribute('data-drag-event') as EventName | null;
    e.currentTarget.setPointerCapture?.(e.pointerId);
    if (marker && p.editable) {
      p.onEventDragStart?.(marker);
      return;
    }
    p.onCursor?.(timeAt(e));
  };
  const onPointerMove = (e: ReactPointerEvent<SVGSVGElement>) => {
    if (p.draggingEvent) p.onEventDrag?.(p.draggingEvent, timeAt(e));
    else if (e.buttons & 1) p.onCursor?.(timeAt(e));
  };
  const onPointerUp = (e: ReactPointerEvent<SVGSVGElement>) => {
    e.currentTarget.releasePointerCapture?.(e.pointerId);
    if (p.draggingEvent) p.onEventDragEnd?.(p.draggingEvent);
  };
  // a focused marker moves one sample per arrow press; delegated here so the memoised layers hold no handlers
  const onKeyDown = (e: ReactKeyboardEvent<SVGSVGElement>) => {
    if (!p.editable || (e.key !== 'ArrowLeft' && e.key !== 'ArrowRight')) return;
    const name = (e.target as Element).closest?.('[data-event-marker]')?.getAttribute('data-event-marker') as EventName | null;
    if (!name) return;
    e.preventDefault();
    e.stopPropagation();
    p.onEventNudge?.(name, e.key === 'ArrowLeft' ? -1 : 1);
  };

  const legend: LegendItem[] = p.lines.map((l) => ({ label: l.label, tone: l.tone, overlay: l.overlay }));
  if (p.band) legend.push({ label: p.band.label, tone: 'band' });

  const interactive = !!p.onCursor || !!p.editable;
  const cursorPx = p.cursorTime != null && Number.isFinite(p.cursorTime) ? x(p.cursorTime) : null;
  const { cursorTime: _c, onCursor: _o, onEventDragStart: _s, onEventDrag: _d, onEventDragEnd: _e, onEventNudge: _n, title: _t, description: _ds, ...layerProps } = p;

  return (
    <figure className="m-0" data-chart={p.id}>
      <figcaption className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-0.5 pl-10 pr-3">
        <span id={`${p.id}-title`} className="text-sm font-semibold text-ink">
          {p.title}
          <span className="font-normal text-ink-muted">, {p.unit}</span>
        </span>
        <ChartLegend items={legend} />
      </figcaption>
      <svg
        width="100%"
        viewBox={`0 0 ${p.width} ${p.height}`}
        preserveAspectRatio="xMidYMid meet"
        // with focusable markers the svg is a group holding named sliders (an img role would hide them: its
        // children are presentational); otherwise one image with the title and the description
        role={p.focusableMarkers ? 'group' : 'img'}
        aria-labelledby={`${p.id}-title`}
        aria-describedby={p.description ? `${p.id}-desc` : undefined}
        className={`block select-none ${interactive ? 'touch-none' : ''}`}
        style={{ fontSize: FONT_PX, cursor: p.draggingEvent ? 'ew-resize' : interactive ? 'crosshair' : undefined }}
        onPointerDown={interactive ? onPointerDown : undefined}
        onPointerMove={interactive ? onPointerMove : undefined}
        onPointerUp={interactive ? onPointerUp : undefined}
        onPointerCancel={interactive ? onPointerUp : undefined}
        onKeyDown={p.editable ? onKeyDown : undefined}
      >
        {p.description && <desc id={`${p.id}-desc`}>{p.description}</desc>}
        <g transform={`translate(${box.margin.left},${box.margin.top})`}>
          <ChartLayers {...layerProps} />
          {cursorPx != null && cursorPx >= 0 && cursorPx <= w && (
            <line data-cursor aria-hidden="true" x1={cursorPx} x2={cursorPx} y1={0} y2={h} stroke={CHART_COLOURS.ink} strokeWidth={1.25} pointerEvents="none" />
          )}
        </g>
      </svg>
    </figure>
  );
}
