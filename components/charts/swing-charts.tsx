// The three swing charts on the shared time axis: lead share, heel share of each foot, COP speed. Each is a
// TimeSeriesChart with its lines, guides and table; the viewer passes the same domain, cursor and events to all.
import type { EventName } from '@/lib/signal/types';
import { ChartTable, type TableColumn } from './chart-table';
import { visibleRange } from './lib/downsample';
import { nearestIndex } from './lib/nearest';
import { finiteExtent, zeroBasedDomain } from './lib/scales';
import type { LineSpec, SwingEvents, TimeBand, TraceSeries } from './lib/types';
import { TimeSeriesChart, type EventDragHandlers } from './time-series-chart';

export interface SwingChartProps extends EventDragHandlers {
  series: TraceSeries;
  /** shared x domain, s */
  domain: [number, number];
  width: number;
  height?: number;
  events?: SwingEvents;
  corrected?: Partial<Record<EventName, boolean>>;
  cursorTime?: number | null;
  timeZero?: number;
  /** a second swing, its time already aligned to this one (alignOverlay) */
  overlay?: { label: string; series: TraceSeries } | null;
  band?: TimeBand | null;
  showTimeAxis?: boolean;
  editable?: boolean;
  focusableMarkers?: boolean;
  draggingEvent?: EventName | null;
  onCursor?: (t: number) => void;
  /** the table fallback under the chart (default on) */
  table?: boolean;
  /** prefix for element ids when several viewers share a page */
  idPrefix?: string;
}

function eventRows(series: TraceSeries, events?: SwingEvents): Record<number, string> | undefined {
  if (!events) return undefined;
  const out: Record<number, string> = {};
  for (const [name, t] of Object.entries(events)) if (Number.isFinite(t)) out[nearestIndex(series.time, t)] = name;
  return out;
}

function Chart(p: SwingChartProps & { id: string; title: string; description: string; unit: string; lines: LineSpec[]; yDomain: [number, number]; yTicks?: number[]; guides?: { value: number; label: string }[]; emphasisEvents?: readonly EventName[]; showEventLabels?: boolean; columns: TableColumn[]; defaultHeight: number }) {
  const id = `${p.idPrefix ?? 'swing'}-${p.id}`;
  return (
    <div>
      <TimeSeriesChart
        id={id}
        title={p.title}
        description={p.description}
        time={p.series.time}
        lines={p.lines}
        domain={p.domain}
        yDomain={p.yDomain}
        yTicks={p.yTicks}
        unit={p.unit}
        width={p.width}
        height={p.height ?? p.defaultHeight}
        events={p.events}
        emphasisEvents={p.emphasisEvents}
        corrected={p.corrected}
        showEventLabels={p.showEventLabels}
        showPhases
        showPhaseLabels={p.showEventLabels}
        guides={p.guides}
        band={p.band}
        cursorTime={p.cursorTime}
        timeZero={p.timeZero}
        showTimeAxis={p.showTimeAxis}
        editable={p.editable}
        focusableMarkers={p.focusableMarkers}
        draggingEvent={p.draggingEvent}
        onCursor={p.onCursor}
        onEventDragStart={p.onEventDragStart}
        onEventDrag={p.onEventDrag}
        onEventDragEnd={p.onEventDragEnd}
        onEventNudge={p.onEventNudge}
      />
      {p.table !== false && (
        <ChartTable
          caption={`${p.title}: values at each sample`}
          time={p.series.time}
          columns={p.columns}
          range={visibleRange(p.series.time, p.domain[0], p.domain[1])}
          timeZero={p.timeZero}
          eventAt={eventRows(p.series, p.events)}
        />
      )}
    </div>
  );
}

const PCT_TICKS = [0, 25, 50, 75, 100];

/** Lead-foot share of the total force, 0-100 %, with the 50 % guide; carries the event labels and phase names. */
export function LeadShareChart(p: SwingChartProps) {
  const lines: LineSpec[] = [{ id: 'lead-pct', label: 'Lead foot %', values: p.series.leadPct, tone: 'lead' }];
  if (p.overlay) lines.push({ id: 'overlay-lead-pct', label: `Lead foot %, ${p.overlay.label}`, values: p.overlay.series.leadPct, time: p.overlay.series.time, tone: 'lead', overlay: true });
  return (
    <Chart
      {...p}
      id="lead-share"
      title="Lead share"
      description="Share of the total force on the lead foot over the swing, 0 to 100 percent; 50 percent is an even split."
      unit="%"
      lines={lines}
      yDomain={[0, 100]}
      yTicks={PCT_TICKS}
      guides={[{ value: 50, label: 'even' }]}
      showEventLabels
      columns={[{ label: 'lead %', values: p.series.leadPct }]}
      defaultHeight={168}
    />
  );
}

/** Heel share of each foot, 0-100 %: lead solid, trail dashed. */
export function HeelShareChart(p: SwingChartProps) {
  const lines: LineSpec[] = [
    { id: 'lead-heel-pct', label: 'Lead heel %', values: p.series.leadHeelPct, tone: 'lead' },
    { id: 'trail-heel-pct', label: 'Trail heel %', values: p.series.trailHeelPct, tone: 'trail' },
  ];
  if (p.overlay) {
    const o = p.overlay.series;
    lines.push({ id: 'overlay-lead-heel', label: `Lead heel %, ${p.overlay.label}`, values: o.leadHeelPct, time: o.time, tone: 'lead', overlay: true });
    lines.push({ id: 'overlay-trail-heel', label: `Trail heel %, ${p.overlay.label}`, values: o.trailHeelPct, time: o.time, tone: 'trail', overlay: true });
  }
  return (
    <Chart
      {...p}
      id="heel-share"
      title="Heel share of each foot"
      description="Share of each foot's own force on its heel, 0 to 100 percent; the rest is on the toes."
      unit="%"
      lines={lines}
      yDomain={[0, 100]}
      yTicks={PCT_TICKS}
      columns={[
        { label: 'lead heel %', values: p.series.leadHeelPct },
        { label: 'trail heel %', values: p.series.trailHeelPct },
      ]}
      defaultHeight={122}
    />
  );
}

/** COP speed, mm/s, with dots where the velocity events (transition, impact) were found. */
export function CopSpeedChart(p: SwingChartProps) {
  const lines: LineSpec[] = [{ id: 'cop-speed', label: 'COP speed', values: p.series.copSpeed, tone: 'neutral' }];
  if (p.overlay) lines.push({ id: 'overlay-cop-speed', label: `COP speed, ${p.overlay.label}`, values: p.overlay.series.copSpeed, time: p.overlay.series.time, tone: 'neutral', overlay: true });
  // scaled to what is in view, so walking before the swing does not flatten the swing's own peaks
  const own = finiteExtent([p.series.copSpeed], p.series.time, p.domain[0], p.domain[1]);
  const other = p.overlay ? finiteExtent([p.overlay.series.copSpeed], p.overlay.series.time, p.domain[0], p.domain[1]) : null;
  const yDomain = zeroBasedDomain(own && other ? [Math.min(own[0], other[0]), Math.max(own[1], other[1])] : (own ?? other));
  return (
    <Chart
      {...p}
      id="cop-speed"
      title="COP speed"
      description="Speed of the combined centre of pressure in millimetres per second; circles mark the transition and impact, found from the COP velocity."
      unit="mm/s"
      lines={lines}
      yDomain={yDomain}
      emphasisEvents={['transition', 'impact']}
      columns={[{ label: 'COP speed mm/s', values: p.series.copSpeed, digits: 0 }]}
      defaultHeight={122}
      showTimeAxis={p.showTimeAxis ?? true}
    />
  );
}
