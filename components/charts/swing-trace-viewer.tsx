'use client';
// The swing on one time axis: lead share, heel share and COP speed charts stacked, the COP path over the insoles
// beside them, a shared cursor moved by pointer, scrubber or keyboard, zoom, draggable event markers with undo,
// and the values panel. Data comes in as props; saving is the caller's (onEventsChange).
import { useCallback, useEffect, useMemo, useRef, useState, type KeyboardEvent, type ReactNode } from 'react';
import { EVENT_NAMES, type EventName, type Handedness, type SensorLayout } from '@/lib/signal/types';
import { formatSeconds } from './format';
import { bandOnTime, type ReferenceBand } from './lib/bands';
import { visibleRange } from './lib/downsample';
import { commit, moveEvent, sameEvents, startHistory, undo, type EventHistory } from './lib/event-edit';
import { stepCursor, stepForKey } from './lib/keyboard';
import { nearestIndex } from './lib/nearest';
import { alignOverlay, type OverlayTrace } from './lib/overlay';
import { phaseAt, phaseLabel } from './lib/phase-bands';
import type { SwingEvents, TimeWindow, TraceSeries } from './lib/types';
import { StancePathChart, type SensorFrames } from './stance-path-chart';
import { CopSpeedChart, HeelShareChart, LeadShareChart } from './swing-charts';
import { ValuesPanel } from './values-panel';

export type ZoomLevel = 'trace' | 'window' | 'address-finish';

export interface SwingTraceViewerProps {
  series: TraceSeries;
  /**
   * the whole recording, coarsened for display (min/max per bucket): drawn at the "Whole recording" zoom, where
   * markers are read-only (too coarse to move an event on); without it that zoom shows the whole stored series
   */
  wholeSeries?: TraceSeries | null;
  /** the swing's window on the recording's time axis; events must stay inside it */
  window: TimeWindow;
  events: SwingEvents;
  /** the automatic events: an event whose time differs from these is marked corrected */
  autoEvents?: SwingEvents;
  /** events the server already holds as moved by hand (used when autoEvents is not given) */
  corrected?: Partial<Record<EventName, boolean>>;
  layout: SensorLayout;
  handedness: Handedness;
  stanceWidthMm: number;
  sensorFrames?: SensorFrames | null;
  /** a second swing; drawn dotted, its impact lined up with this one's */
  overlay?: OverlayTrace | null;
  /** reference band for the lead share (mean +- k SD, on time or on the registered swing axis) */
  leadBand?: ReferenceBand | null;
  readOnly?: boolean;
  /** called with the full new set of events after a drag, a keyboard nudge or an undo */
  onEventsChange?: (next: SwingEvents) => void;
  onCursorChange?: (t: number) => void;
  initialCursorTime?: number;
  /** a cursor time set from outside (a playing video); a new value moves the cursor without calling onCursorChange */
  externalCursorTime?: number | null;
  initialZoom?: ZoomLevel;
  /** tick labels are seconds from this time (default: the window start) */
  timeZero?: number;
  /** the page's own controls (previous / next swing, overlay picker), shown in the toolbar */
  actions?: ReactNode;
  idPrefix?: string;
  /** chart width before the first measurement (server render), px */
  initialWidth?: number;
}

const ZOOMS: { id: ZoomLevel; label: string }[] = [
  { id: 'address-finish', label: 'Address to finish' },
  { id: 'window', label: 'Swing window' },
  { id: 'trace', label: 'Whole recording' },
];

/** Half a second either side of address and finish, inside the trace (common practice for a readable swing view). */
const ADDRESS_FINISH_MARGIN_S = 0.25;

export function zoomDomain(zoom: ZoomLevel, time: ArrayLike<number>, window: TimeWindow, events: SwingEvents): [number, number] {
  const t0 = time[0];
  const t1 = time[time.length - 1];
  const clamp = (d: [number, number]): [number, number] => {
    const a = Math.max(t0, d[0]);
    const b = Math.min(t1, d[1]);
    return b > a ? [a, b] : [t0, t1];
  };
  if (zoom === 'trace') return [t0, t1];
  if (zoom === 'window') return clamp([window.startS, window.endS]);
  return clamp([events.address - ADDRESS_FINISH_MARGIN_S, events.finish + ADDRESS_FINISH_MARGIN_S]);
}

function useWidth(initial: number) {
  const ref = useRef<HTMLDivElement>(null);
  const [width, setWidth] = useState(initial);
  useEffect(() => {
    const el = ref.current;
    if (!el || typeof ResizeObserver === 'undefined') return;
    const ro = new ResizeObserver((entries) => {
      const w = Math.round(entries[0].contentRect.width);
      if (w > 0) setWidth(w);
    });
    ro.observe(el);
    return () => ro.disconnect();
  }, []);
  return [ref, width] as const;
}

export function SwingTraceViewer(p: SwingTraceViewerProps) {
  const { series: swingSeries, window: win } = p;
  if (swingSeries.time.length < 2) throw new RangeError('SwingTraceViewer needs a series with at least two samples');
  const [zoom, setZoom] = useState<ZoomLevel>(p.initialZoom ?? 'address-finish');
  const wholeView = zoom === 'trace' && !!p.wholeSeries && p.wholeSeries.time.length >= 2;
  // the charts draw the whole recording at that zoom; the COP path and the values stay on the swing's full-rate series
  const series = wholeView ? p.wholeSeries! : swingSeries;
  const time = series.time;
  const editable = !p.readOnly && !!p.onEventsChange && !wholeView;
  const prefix = p.idPrefix ?? 'swing';
  const zero = p.timeZero ?? win.startS;

  const [history, setHistory] = useState<EventHistory>(() => startHistory(p.events));
  const [seenEvents, setSeenEvents] = useState(p.events);
  if (!sameEvents(seenEvents, p.events)) {
    // the caller's events changed (saved, reset on the server): they become the committed state, undo kept
    setSeenEvents(p.events);
    setHistory((h) => commit(h, p.events));
  }
  const [draft, setDraft] = useState<SwingEvents | null>(null);
  const [dragging, setDragging] = useState<EventName | null>(null);
  const events = draft ?? history.present;

  // the domain follows the committed events, not the draft, so the axis stays still while a marker moves
  const domain = useMemo(() => zoomDomain(zoom, time, win, history.present), [zoom, time, win, history.present]);
  const [lo, hi] = useMemo(() => visibleRange(time, domain[0], domain[1]), [time, domain]);

  // the cursor is a time, so it stays put when the zoom swaps the swing's series for the whole recording's
  const [cursorAt, setCursorAt] = useState(() => p.initialCursorTime ?? p.events.top);
  const [seenExternal, setSeenExternal] = useState(p.externalCursorTime ?? null);
  if ((p.externalCursorTime ?? null) !== seenExternal) {
    setSeenExternal(p.externalCursorTime ?? null);
    if (p.externalCursorTime != null) setCursorAt(p.externalCursorTime);
  }
  const cursor = Math.min(hi, Math.max(lo, nearestIndex(time, cursorAt)));
  const cursorTime = time[cursor];
  const onCursorChange = p.onCursorChange;
  const setCursor = useCallback(
    (i: number) => {
      setCursorAt(time[i]);
      onCursorChange?.(time[i]);
    },
    [time, onCursorChange],
  );
  const swingDomain = useMemo(() => (wholeView ? zoomDomain('window', swingSeries.time, win, history.present) : domain), [wholeView, swingSeries.time, win, history.present, domain]);

  const [chartsRef, width] = useWidth(p.initialWidth ?? 820);

  const corrected = useMemo(() => {
    const out: Partial<Record<EventName, boolean>> = {};
    for (const n of EVENT_NAMES) out[n] = p.autoEvents ? events[n] !== p.autoEvents[n] : !!p.corrected?.[n] || events[n] !== p.events[n];
    return out;
  }, [events, p.autoEvents, p.corrected, p.events]);

  const overlay = useMemo(() => (p.overlay ? { label: p.overlay.label, series: alignOverlay(p.overlay, history.present) } : null), [p.overlay, history.present]);
  const leadBand = useMemo(() => (p.leadBand ? bandOnTime(p.leadBand, events) : null), [p.leadBand, events]);

  const onEventsChange = p.onEventsChange;
  const commitEvents = (next: SwingEvents) => {
    if (sameEvents(next, history.present)) return;
    setHistory((h) => commit(h, next));
    onEventsChange?.(next);
  };
  const doUndo = () => {
    if (history.past.length === 0) return;
    const h = undo(history);
    setHistory(h);
    onEventsChange?.(h.present);
  };
  const drag = editable
    ? {
        onEventDragStart: (name: EventName) => {
          setDragging(name);
          setDraft(history.present);
        },
        onEventDrag: (name: EventName, t: number) => {
          const next = moveEvent(time, draft ?? history.present, name, t, win);
          setDraft(next);
          setCursor(nearestIndex(time, next[name]));
        },
        onEventDragEnd: () => {
          if (draft) commitEvents(draft);
          setDraft(null);
          setDragging(null);
        },
        onEventNudge: (name: EventName, direction: -1 | 1) => {
          const i = nearestIndex(time, history.present[name]) + direction;
          if (i < 0 || i >= time.length) return;
          const next = moveEvent(time, history.present, name, time[i], win);
          commitEvents(next);
          setCursor(nearestIndex(time, next[name]));
        },
      }
    : {};

  const onKeyDown = (e: KeyboardEvent<HTMLDivElement>) => {
    if (editable && (e.ctrlKey || e.metaKey) && e.key.toLowerCase() === 'z') {
      e.preventDefault();
      doUndo();
      return;
    }
    if (e.key === 'Escape' && dragging) {
      setDraft(null);
      setDragging(null);
      return;
    }
    if (e.ctrlKey || e.metaKey || e.altKey) return;
    const step = stepForKey(e.key, e.shiftKey);
    if (!step) return;
    e.preventDefault();
    setCursor(stepCursor(cursor, step, time, events, lo, hi));
  };

  const phase = phaseAt(events, cursorTime);
  const onEvent = EVENT_NAMES.find((n) => nearestIndex(time, events[n]) === cursor);
  const where = onEvent ? `at ${onEvent}` : phase ? phaseLabel(phase) : 'outside the swing';
  const common = {
    series,
    domain,
    width,
    events,
    corrected,
    cursorTime,
    timeZero: zero,
    overlay,
    editable,
    draggingEvent: dragging,
    onCursor: (t: number) => setCursor(Math.min(hi, Math.max(lo, nearestIndex(time, t)))),
    idPrefix: prefix,
    ...drag,
  };

  return (
    <div
      className="rounded-lg border border-surface-line bg-surface p-3 focus-visible:outline-2"
      tabIndex={0}
      role="group"
      aria-label="Swing traces"
      aria-describedby={`${prefix}-keys`}
      onKeyDown={onKeyDown}
      data-swing-viewer
    >
      <div className="mb-2 flex flex-wrap items-center gap-x-4 gap-y-2">
        <div role="group" aria-label="Zoom" className="inline-flex overflow-hidden rounded-md border border-surface-line text-sm">
          {ZOOMS.map((z) => (
            <button
              key={z.id}
              type="button"
              aria-pressed={zoom === z.id}
              onClick={() => setZoom(z.id)}
              className={`min-h-11 px-3 text-sm ${zoom === z.id ? 'bg-ink text-white' : 'bg-surface text-ink-muted hover:bg-surface-sunken'}`}
            >
              {z.label}
            </button>
          ))}
        </div>
        {editable && (
          <button
            type="button"
            onClick={doUndo}
            disabled={history.past.length === 0}
            className="min-h-11 rounded-md border border-surface-line px-3 text-sm text-ink hover:bg-surface-sunken disabled:text-ink-faint"
            data-undo
          >
            Undo marker move{history.past.length ? ` (${history.past.length})` : ''}
          </button>
        )}
        <p className="text-sm tabular-nums text-ink" aria-live="polite" data-cursor-readout>
          <span className="font-semibold">{formatSeconds(cursorTime - zero, 2)} s</span>
          <span className="text-ink-muted"> · {where}</span>
        </p>
        {p.actions && <div className="ml-auto flex items-center gap-2">{p.actions}</div>}
      </div>
      <div className="grid gap-3 lg:grid-cols-[minmax(0,1fr)_18rem] xl:grid-cols-[minmax(0,1fr)_21rem]">
        <div ref={chartsRef} className="min-w-0 space-y-1">
          <LeadShareChart {...common} band={leadBand} focusableMarkers />
          <HeelShareChart {...common} />
          <CopSpeedChart {...common} />
          <div className="flex items-center gap-2 pl-10 pr-3 pt-1">
            <label htmlFor={`${prefix}-scrubber`} className="text-sm text-ink-muted">
              Cursor
            </label>
            <input
              id={`${prefix}-scrubber`}
              type="range"
              min={lo}
              max={hi}
              step={1}
              value={cursor}
              onChange={(e) => setCursor(Number(e.target.value))}
              aria-valuetext={`${formatSeconds(cursorTime - zero, 2)} s, ${where}`}
              className="h-1.5 w-full accent-ink"
              data-scrubber
            />
          </div>
        </div>
        <div className="min-w-0 space-y-2">
          <StancePathChart
            series={swingSeries}
            domain={swingDomain}
            layout={p.layout}
            handedness={p.handedness}
            stanceWidthMm={p.stanceWidthMm}
            width={320}
            events={events}
            cursorTime={cursorTime}
            sensorFrames={p.sensorFrames}
            overlay={overlay}
            timeZero={zero}
            idPrefix={prefix}
          />
          <ValuesPanel series={swingSeries} events={events} cursorTime={cursorTime} corrected={corrected} timeZero={zero} />
          <p id={`${prefix}-keys`} className="text-sm leading-snug text-ink-faint">
            Times in s from address (address = 0 s). ← → one sample · Shift+← → or [ ] event to event · Home / End ends of view
            {editable ? ' · drag a marker (or focus it and press ← →) to move an event · Ctrl+Z undoes' : ''}
            {editable ? ' · * moved by hand' : ''}
            {wholeView && !p.readOnly && p.onEventsChange ? ' · zoom in to move a marker' : ''}
          </p>
        </div>
      </div>
    </div>
  );
}
