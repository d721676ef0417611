// The combined COP path in the stance frame over both insole outlines (equal mm scale on both axes), with each
// sensor as a dot whose area and opacity follow its force at the cursor time. No hooks: server-renderable.
import type { Handedness, SensorLayout } from '@/lib/signal/types';
import { EVENT_NAMES, type EventName } from '@/lib/signal/types';
import { ChartTable } from './chart-table';
import { formatSeconds } from './format';
import { visibleRange, sliceRange } from './lib/downsample';
import { placeLabels } from './lib/point-labels';
import { forceRadius, insoleOutline, outlinePath, sensorsInStance } from './lib/insole';
import { nearestIndex } from './lib/nearest';
import { CHART_COLOURS, OVERLAY_STYLE, TONE_STYLE } from './lib/palette';
import { xyPath } from './lib/paths';
import { scaleLinear } from 'd3';
import type { NumArray, SwingEvents, TraceSeries } from './lib/types';

/** Per-sensor forces at some times (every sample, or only at the events): N, NaN when missing. */
export interface SensorFrames {
  timeS: NumArray;
  forcesN: Record<string, NumArray>;
}

export interface StancePathChartProps {
  series: Pick<TraceSeries, 'time' | 'copX' | 'copY'>;
  /** the time span whose path is drawn, s */
  domain: [number, number];
  layout: SensorLayout;
  handedness: Handedness;
  stanceWidthMm: number;
  width: number;
  /** default: what the stance needs at this width (equal mm scale on both axes) */
  height?: number;
  events?: SwingEvents;
  cursorTime?: number | null;
  sensorFrames?: SensorFrames | null;
  overlay?: { label: string; series: Pick<TraceSeries, 'time' | 'copX' | 'copY'> } | null;
  timeZero?: number;
  table?: boolean;
  idPrefix?: string;
}

const MARGIN = 10;
const LABEL_SPACE = 16;

function frameAt(frames: SensorFrames, t: number | null | undefined) {
  if (frames.timeS.length === 0 || t == null || !Number.isFinite(t)) return null;
  return nearestIndex(frames.timeS, t);
}

function maxForce(frames: SensorFrames): number {
  let m = 0;
  for (const v of Object.values(frames.forcesN)) for (let i = 0; i < v.length; i++) if (v[i] > m) m = v[i];
  return m;
}

export function StancePathChart(p: StancePathChartProps) {
  const L = p.layout.foot_length_mm;
  const halfW = p.stanceWidthMm / 2;
  // X spans both insoles with room for the outline's width; Y spans heel to toe.
  const xDom: [number, number] = [-halfW - 0.26 * L, halfW + 0.26 * L];
  const yDom: [number, number] = [-L / 2 - 8, L / 2 + 8];
  const iw = p.width - 2 * MARGIN;
  const height = p.height ?? Math.round((iw * (yDom[1] - yDom[0])) / (xDom[1] - xDom[0]) + 2 * MARGIN + LABEL_SPACE);
  const ih = height - 2 * MARGIN - LABEL_SPACE;
  const k = Math.min(iw / (xDom[1] - xDom[0]), ih / (yDom[1] - yDom[0])); // px per mm, same on both axes
  const cx = MARGIN + iw / 2;
  const cy = MARGIN + ih / 2;
  const x = scaleLinear().domain([0, 1]).range([cx, cx + k]);
  const y = scaleLinear().domain([0, 1]).range([cy, cy - k]);
  const footY = y(yDom[0]) + 12;

  const lead = insoleOutline(p.layout, true, p.stanceWidthMm);
  const trail = insoleOutline(p.layout, false, p.stanceWidthMm);
  const sensors = sensorsInStance(p.layout, p.handedness, p.stanceWidthMm);

  const [i0, i1] = visibleRange(p.series.time, p.domain[0], p.domain[1]);
  const cursorI = p.cursorTime != null && Number.isFinite(p.cursorTime) && p.series.time.length ? nearestIndex(p.series.time, p.cursorTime) : null;
  const path = xyPath(sliceRange(p.series.copX, i0, i1), sliceRange(p.series.copY, i0, i1), x, y);
  const travelled = cursorI != null && cursorI >= i0 ? xyPath(sliceRange(p.series.copX, i0, Math.min(i1, cursorI)), sliceRange(p.series.copY, i0, Math.min(i1, cursorI)), x, y) : '';
  let overlayPath = '';
  if (p.overlay) {
    const [o0, o1] = visibleRange(p.overlay.series.time, p.domain[0], p.domain[1]);
    overlayPath = xyPath(sliceRange(p.overlay.series.copX, o0, o1), sliceRange(p.overlay.series.copY, o0, o1), x, y);
  }

  const frames = p.sensorFrames ?? null;
  const fi = frames ? frameAt(frames, p.cursorTime) : null;
  const fMax = frames ? maxForce(frames) : 0;
  const frameTime = frames && fi != null ? frames.timeS[fi] : NaN;
  const zero = p.timeZero ?? 0;
  // frames stored only at the events are named after them, so a cursor between events is not mistaken for live
  const frameEvent = p.events && Number.isFinite(frameTime) ? EVENT_NAMES.find((n) => Math.abs(p.events![n] - frameTime) < 1e-6) : undefined;

  const eventPoints = p.events
    ? EVENT_NAMES.map((n: EventName) => {
        const i = nearestIndex(p.series.time, p.events![n]);
        return { name: n, x: p.series.copX[i], y: p.series.copY[i] };
      }).filter((e) => Number.isFinite(e.x) && Number.isFinite(e.y))
    : [];
  const labels = placeLabels(eventPoints.map((e) => ({ x: x(e.x), y: y(e.y), text: e.name })));
  const cursorPt = cursorI != null ? { x: p.series.copX[cursorI], y: p.series.copY[cursorI] } : null;
  const id = `${p.idPrefix ?? 'swing'}-stance-path`;

  return (
    <figure className="m-0" data-chart={id}>
      <figcaption className="flex flex-wrap items-baseline justify-between gap-x-3 px-3">
        <span id={`${id}-title`} className="text-sm font-semibold text-ink">
          COP path over the stance
        </span>
        <span className="text-sm text-ink-muted">
          {frames && fi != null ? `sensor forces at ${frameEvent ? `${frameEvent}, ` : ''}${formatSeconds(frameTime - zero)} s` : 'toward target →'}
        </span>
      </figcaption>
      <svg width="100%" viewBox={`0 0 ${p.width} ${height}`} role="img" aria-labelledby={`${id}-title`} aria-describedby={`${id}-desc`} className="block" style={{ fontSize: 14 }}>
        <desc id={`${id}-desc`}>
          Path of the combined centre of pressure from the lead and trail insoles, seen from above with the target to the right and the
          toes up. Sensor dots grow with their force.
        </desc>
        {([['lead', lead], ['trail', trail]] as const).map(([foot, pts]) => (
          <g key={foot} data-insole={foot}>
            <path d={outlinePath(pts, x, y)} fill={CHART_COLOURS.surface} stroke={TONE_STYLE[foot].stroke} strokeWidth={1.5} strokeDasharray={TONE_STYLE[foot].dash} />
            <text x={x(foot === 'lead' ? halfW : -halfW)} y={footY} textAnchor="middle" fill={CHART_COLOURS.inkMuted}>
              {foot}
            </text>
          </g>
        ))}
        <g data-layer="sensors">
          {sensors.map((s) => {
            const f = frames && fi != null ? frames.forcesN[s.id]?.[fi] : undefined;
            const known = f !== undefined && Number.isFinite(f);
            const share = known && fMax > 0 ? Math.max(0, f) / fMax : 0;
            const colour = s.lead ? CHART_COLOURS.lead : CHART_COLOURS.trail;
            return (
              <circle
                key={s.id}
                data-sensor={s.id}
                cx={x(s.x)}
                cy={y(s.y)}
                r={known ? forceRadius(f, fMax) : 2.5}
                fill={known ? colour : 'none'}
                fillOpacity={known ? 0.2 + 0.6 * share : 0}
                stroke={colour}
                strokeOpacity={0.7}
                strokeWidth={0.75}
              >
                <title>{`${s.id}: ${known ? `${Math.round(f)} N` : 'no value'}`}</title>
              </circle>
            );
          })}
        </g>
        {overlayPath && <path d={overlayPath} fill="none" stroke={CHART_COLOURS.inkMuted} strokeWidth={OVERLAY_STYLE.width} strokeDasharray={OVERLAY_STYLE.dash} strokeLinecap="round" strokeOpacity={OVERLAY_STYLE.opacity} data-overlay-path />}
        <path d={path} fill="none" stroke={CHART_COLOURS.inkFaint} strokeWidth={1.25} data-cop-path />
        {travelled && <path d={travelled} fill="none" stroke={CHART_COLOURS.ink} strokeWidth={1.75} strokeLinejoin="round" />}
        {eventPoints.map((e, k) => (
          <g key={e.name} data-cop-event={e.name}>
            <rect x={x(e.x) - 3} y={y(e.y) - 3} width={6} height={6} fill={CHART_COLOURS.surface} stroke={CHART_COLOURS.ink} strokeWidth={1.25} />
            {labels[k] && (
              <>
                <line x1={x(e.x)} y1={y(e.y)} x2={labels[k]!.anchorX} y2={labels[k]!.anchorY} stroke={CHART_COLOURS.inkFaint} strokeWidth={0.75} />
                <text x={labels[k]!.x} y={labels[k]!.y} textAnchor={labels[k]!.anchor} fill={CHART_COLOURS.ink} style={{ fontSize: 14 }} paintOrder="stroke" stroke={CHART_COLOURS.surface} strokeWidth={3}>
                  {e.name}
                </text>
              </>
            )}
          </g>
        ))}
        {cursorPt && Number.isFinite(cursorPt.x) && Number.isFinite(cursorPt.y) && (
          <circle data-cursor cx={x(cursorPt.x)} cy={y(cursorPt.y)} r={5} fill={CHART_COLOURS.ink} stroke={CHART_COLOURS.surface} strokeWidth={2} />
        )}
      </svg>
      {p.table !== false && (
        <ChartTable
          caption="Pressure path between the feet (COP, from the middle of the stance), mm"
          time={p.series.time}
          columns={[
            { label: 'COP x mm', values: p.series.copX },
            { label: 'COP y mm', values: p.series.copY },
          ]}
          range={[i0, i1]}
          timeZero={p.timeZero}
          inset={false}
        />
      )}
    </figure>
  );
}
