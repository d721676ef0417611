// The static layers of a time chart (phases, grid, axes, band, guides, lines, event markers): everything but the
// cursor. Memoised, so moving the cursor redraws one line per chart instead of every path.
import { memo } from 'react';
import { EVENT_NAMES } from '@/lib/signal/types';
import { formatSeconds } from './format';
import { minMaxDownsample, sliceRange, visibleRange } from './lib/downsample';
import { placeLabels, textWidth } from './lib/label-layout';
import { valueAt } from './lib/nearest';
import { BAND_FILL_OPACITY, CHART_COLOURS, OVERLAY_STYLE, PHASE_FILLS, TONE_STYLE } from './lib/palette';
import { bandPath, linePath } from './lib/paths';
import { phaseLabel, phaseSpans } from './lib/phase-bands';
import type { NumArray } from './lib/types';
import { chartGeometry, FONT_PX, LABEL_ROW_PX, LABEL_ROWS, MARGIN } from './time-chart-geometry';
import type { TimeSeriesChartProps } from './time-series-chart-props';

export type LayerProps = Omit<TimeSeriesChartProps, 'cursorTime' | 'onCursor' | 'onEventDragStart' | 'onEventDrag' | 'onEventDragEnd' | 'onEventNudge' | 'title' | 'description'>;

/** The line drawn at display resolution: only the visible samples, min/max per pixel when there are many. */
function displayPoints(time: NumArray, values: NumArray, domain: [number, number], pixels: number) {
  const [i0, i1] = visibleRange(time, domain[0], domain[1]);
  const t = sliceRange(time, i0, i1);
  const v = sliceRange(values, i0, i1);
  return t.length > pixels * 2 ? minMaxDownsample(t, v, Math.max(1, Math.floor(pixels))) : { time: t, values: v };
}

const eventWord = (name: string) => name.charAt(0).toUpperCase() + name.slice(1);

function ChartLayersInner(p: LayerProps) {
  const { box, w, h, x, y } = chartGeometry(p);
  const clampX = (px: number) => Math.min(w, Math.max(0, px));
  const yTicks = p.yTicks ?? y.ticks(3);
  const zero = p.timeZero ?? 0;
  // ticks are chosen on the relative axis (seconds from timeZero), so they fall on round relative times
  const tickCount = Math.max(2, Math.floor(w / 90));
  const relative = x.copy().domain([p.domain[0] - zero, p.domain[1] - zero]);
  const tickLabel = relative.tickFormat(tickCount);
  const xTicks = relative.ticks(tickCount).map((t) => ({ t: t + zero, label: tickLabel(t) }));
  const names = p.eventNames ?? EVENT_NAMES;
  const events = p.events;
  const spans = events && p.showPhases !== false ? phaseSpans(events) : [];
  const clipId = `${p.id}-clip`;
  const markers = events
    ? names
        .filter((n) => Number.isFinite(events[n]) && events[n] >= p.domain[0] && events[n] <= p.domain[1])
        .map((n) => ({ name: n, t: events[n], px: x(events[n]), corrected: !!p.corrected?.[n] }))
    : [];
  const labelText = (m: (typeof markers)[number]) => (m.corrected ? `${m.name}*` : m.name);
  const places = p.showEventLabels ? placeLabels(markers.map((m) => ({ x: m.px, width: textWidth(labelText(m), FONT_PX) })), w, 4, LABEL_ROWS) : [];
  // the last tick carries the unit ("2.5 s"); a label that would pass the right edge is anchored at its end
  const lastTick = xTicks.length - 1;
  const tickText = (k: number) => (k === lastTick ? `${xTicks[k].label} s` : xTicks[k].label);
  const tickAnchor = (k: number) => (x(xTicks[k].t) + textWidth(tickText(k), FONT_PX) / 2 > w + MARGIN.right - 2 ? 'end' : 'middle');

  // Everything but the markers is drawing only: hidden from assistive technology, whose readers get the title, the
  // description, the table fallback and (in the viewer) the markers as sliders.
  return (
    <>
      <defs aria-hidden="true">
        <clipPath id={clipId}>
          <rect x={0} y={-2} width={w} height={h + 4} />
        </clipPath>
      </defs>
      <g data-layer="phases" aria-hidden="true">
        {spans.map((s, k) => {
          const x0 = clampX(x(s.startS));
          const x1 = clampX(x(s.endS));
          if (x1 <= x0) return null;
          const label = phaseLabel(s.name);
          return (
            <g key={s.name} data-phase={s.name}>
              <rect x={x0} y={0} width={x1 - x0} height={h} fill={PHASE_FILLS[k % 2]} />
              {p.showPhaseLabels && textWidth(label, FONT_PX) < x1 - x0 - 6 && (
                <text x={(x0 + x1) / 2} y={h - 4} textAnchor="middle" fill={CHART_COLOURS.inkMuted} style={{ fontSize: FONT_PX }}>
                  {label}
                </text>
              )}
            </g>
          );
        })}
      </g>
      <g data-layer="grid" aria-hidden="true" stroke={CHART_COLOURS.line} strokeWidth={1}>
        {yTicks.map((v) => (
          <line key={`y${v}`} x1={0} x2={w} y1={y(v)} y2={y(v)} strokeOpacity={0.9} />
        ))}
        <rect x={0} y={0} width={w} height={h} fill="none" />
      </g>
      <g data-layer="y-axis" aria-hidden="true" fill={CHART_COLOURS.inkMuted}>
        {/* the unit on the axis itself, above its top tick, inside the left margin */}
        <text x={-box.margin.left + 2} y={-4} textAnchor="start" data-y-unit>
          {p.unit}
        </text>
        {yTicks.map((v) => (
          <text key={`t${v}`} x={-6} y={y(v)} dy="0.32em" textAnchor="end">
            {v}
          </text>
        ))}
      </g>
      {p.showTimeAxis && (
        <g data-layer="time-axis" aria-hidden="true" fill={CHART_COLOURS.inkMuted}>
          {xTicks.map((k, i) => (
            <text key={`x${k.label}`} x={x(k.t)} y={h + 14} textAnchor={tickAnchor(i)} data-x-tick={k.t - zero}>
              {tickText(i)}
            </text>
          ))}
        </g>
      )}
      <g clipPath={`url(#${clipId})`} aria-hidden="true">
        {p.band && (
          <g data-layer="band">
            <path d={bandPath(p.band.time, p.band.lower, p.band.upper, x, y)} fill={CHART_COLOURS.band} fillOpacity={BAND_FILL_OPACITY} stroke="none" />
            {/* the sky-blue fill alone is too faint to find the band's limits (WCAG 2.1 SC 1.4.11): thin edges and a dashed mean in the darker band hue */}
            <path d={linePath(p.band.time, p.band.lower, x, y)} fill="none" stroke={CHART_COLOURS.bandEdge} strokeWidth={0.75} data-band-edge="lower" />
            <path d={linePath(p.band.time, p.band.upper, x, y)} fill="none" stroke={CHART_COLOURS.bandEdge} strokeWidth={0.75} data-band-edge="upper" />
            {p.band.mean && (
              <path d={linePath(p.band.time, p.band.mean, x, y)} fill="none" stroke={CHART_COLOURS.bandEdge} strokeWidth={1} strokeDasharray="4 3" />
            )}
          </g>
        )}
        {(p.guides ?? []).map((g) => (
          <g key={`g${g.value}`} data-guide={g.value}>
            <line x1={0} x2={w} y1={y(g.value)} y2={y(g.value)} stroke={CHART_COLOURS.inkFaint} strokeDasharray="2 3" />
            <text x={w - 3} y={y(g.value) - 3} textAnchor="end" fill={CHART_COLOURS.inkMuted} style={{ fontSize: FONT_PX }}>
              {g.label}
            </text>
          </g>
        ))}
        <g data-layer="lines" fill="none" strokeLinejoin="round">
          {[...p.lines]
            .sort((a, b) => Number(!!b.overlay) - Number(!!a.overlay))
            .map((l) => {
              const pts = displayPoints(l.time ?? p.time, l.values, p.domain, w);
              const s = TONE_STYLE[l.tone];
              return (
                <path
                  key={l.id}
                  data-line={l.id}
                  d={linePath(pts.time, pts.values, x, y)}
                  stroke={s.stroke}
                  strokeWidth={l.overlay ? OVERLAY_STYLE.width : s.width}
                  strokeDasharray={l.overlay ? OVERLAY_STYLE.dash : s.dash}
                  strokeOpacity={l.overlay ? OVERLAY_STYLE.opacity : 1}
                  strokeLinecap={l.overlay ? 'round' : 'butt'}
                />
              );
            })}
        </g>
      </g>
      <g data-layer="events" aria-hidden={p.focusableMarkers ? undefined : true}>
        {markers.map((m, k) => {
          const first = p.lines.find((l) => !l.overlay);
          const emph = first && p.emphasisEvents?.includes(m.name) ? first : null;
          const ev = emph ? valueAt(emph.time ?? p.time, emph.values, m.t) : NaN;
          const row = places[k]?.row ?? 0;
          const labelX = places[k]?.x ?? m.px;
          const labelY = -box.margin.top + MARGIN.top + LABEL_ROW_PX * (row + 1) - 3;
          const handle = dragHandle(markers, k);
          return (
            <g
              key={m.name}
              data-event-marker={m.name}
              data-corrected={m.corrected ? 'true' : undefined}
              role={p.focusableMarkers ? 'slider' : undefined}
              tabIndex={p.focusableMarkers ? 0 : undefined}
              aria-label={p.focusableMarkers ? `${eventWord(m.name)} marker${m.corrected ? ' (moved by hand)' : ''}` : undefined}
              aria-valuetext={p.focusableMarkers ? `${formatSeconds(m.t - zero)} s` : undefined}
              aria-valuenow={p.focusableMarkers ? Number((m.t - zero).toFixed(3)) : undefined}
              aria-valuemin={p.focusableMarkers ? Number((p.domain[0] - zero).toFixed(3)) : undefined}
              aria-valuemax={p.focusableMarkers ? Number((p.domain[1] - zero).toFixed(3)) : undefined}
              aria-readonly={p.focusableMarkers && !p.editable ? true : undefined}
              className="outline-none [&:focus-visible>line]:[stroke-width:3] [&:focus-visible>line]:[stroke:#1D2430]"
            >
              <line
                x1={m.px}
                x2={m.px}
                y1={p.showEventLabels ? -box.margin.top + MARGIN.top + LABEL_ROW_PX * (row + 1) : 0}
                y2={h}
                stroke={p.draggingEvent === m.name ? CHART_COLOURS.accent : CHART_COLOURS.inkMuted}
                strokeWidth={p.draggingEvent === m.name ? 1.75 : 1}
                strokeDasharray={m.corrected ? undefined : '3 2'}
              />
              {p.showEventLabels && (
                <text x={labelX} y={labelY} textAnchor="middle" fill={CHART_COLOURS.ink} fontStyle={m.corrected ? 'italic' : undefined}>
                  {labelText(m)}
                </text>
              )}
              {emph && Number.isFinite(ev) && (
                <circle cx={m.px} cy={y(ev)} r={3.5} fill={CHART_COLOURS.surface} stroke={CHART_COLOURS.ink} strokeWidth={1.5} data-emphasis={m.name} />
              )}
              {p.editable && (
                // up to 44 px wide: a finger-sized target on a tablet (WCAG 2.5.5 target size), cut at the midpoint to a
                // neighbouring marker so that two close events (top and transition are often 30-60 ms apart) each
                // keep the half nearer to their own line instead of the later one covering the earlier
                <rect data-drag-event={m.name} x={handle.left} y={0} width={handle.width} height={h} fill="transparent" style={{ cursor: 'ew-resize' }} />
              )}
            </g>
          );
        })}
      </g>
    </>
  );
}

const HANDLE_HALF_PX = 22;

/** The drag target of marker k: 44 px centred on its line, cut at the midpoints to its neighbours (at least 2 px). */
export function dragHandle(markers: readonly { px: number }[], k: number): { left: number; width: number } {
  const px = markers[k].px;
  const left = k > 0 ? Math.max(px - HANDLE_HALF_PX, (markers[k - 1].px + px) / 2) : px - HANDLE_HALF_PX;
  const right = k < markers.length - 1 ? Math.min(px + HANDLE_HALF_PX, (px + markers[k + 1].px) / 2) : px + HANDLE_HALF_PX;
  // at least 1 px either side of the line, even where two markers coincide
  const from = Math.min(left, px - 1);
  return { left: from, width: Math.max(right, px + 1) - from };
}

const sameArray = <T,>(a: readonly T[] | undefined, b: readonly T[] | undefined) =>
  a === b || (!!a && !!b && a.length === b.length && a.every((v, i) => v === b[i]));

/** Equal when every input that changes a pixel is the same (arrays by identity, small lists by value). */
export function sameLayers(a: LayerProps, b: LayerProps): boolean {
  const keys = ['id', 'time', 'unit', 'width', 'height', 'events', 'showEventLabels', 'showPhases', 'showPhaseLabels', 'band', 'timeZero', 'showTimeAxis', 'editable', 'focusableMarkers', 'draggingEvent'] as const;
  if (keys.some((k) => a[k] !== b[k])) return false;
  if (!sameArray(a.domain, b.domain) || !sameArray(a.yDomain, b.yDomain) || !sameArray(a.yTicks, b.yTicks)) return false;
  if (!sameArray(a.eventNames, b.eventNames) || !sameArray(a.emphasisEvents, b.emphasisEvents)) return false;
  if (JSON.stringify(a.corrected ?? {}) !== JSON.stringify(b.corrected ?? {}) || JSON.stringify(a.guides ?? []) !== JSON.stringify(b.guides ?? [])) return false;
  return (
    a.lines.length === b.lines.length &&
    a.lines.every((l, i) => {
      const m = b.lines[i];
      return l.id === m.id && l.label === m.label && l.values === m.values && l.time === m.time && l.tone === m.tone && l.overlay === m.overlay;
    })
  );
}

export const ChartLayers = memo(ChartLayersInner, sameLayers);
