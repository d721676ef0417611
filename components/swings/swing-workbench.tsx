'use client';
// The interactive part of /swings/[id]: fetches GET /api/swings/:id (SWR, zod-checked) and lays out the recording
// overview, the trace viewer, the event-edit bar, labels, notes and the phase tables. The coach edits; the student
// (canEdit false) gets the same traces read-only, the shared notes in time order and the phases in plain words.
import { memo, useCallback, useMemo, useState } from 'react';
import useSWR from 'swr';
import { SwingTraceViewer, type SwingEvents } from '@/components/charts';
import { Card } from '@/components/ui/card';
import { Skeleton } from '@/components/ui/skeleton';
import { fetchJson } from '@/lib/fetcher';
import { AnnotationForm, AnnotationList } from './annotations-panel';
import { createCursorStore, useCursorTime, type CursorStore } from './cursor-store';
import { EventEditBar } from './event-edit-bar';
import { EventTable } from './event-table';
import { LabelsForm } from './labels-form';
import { OverlayPicker, useOverlay } from './overlay-picker';
import { PhaseExplainer } from './phase-explainer';
import { PhaseTable } from './phase-table';
import { RecordingOverview } from './recording-overview';
import { CorrectionLog } from './correction-log';
import { errorText, patchSwing, swingUrl } from './swing-api';
import { recordingOverviewResponseSchema, swingViewResponseSchema, type SwingDetail, type SwingView } from '@/lib/contracts/swings';
import { SwingFacts } from './swing-facts';
import { eventRecord, movedEvents, sensorFrames, sensorLayout, traceSeries, wholeTraceSeries } from './swing-view-model';
import { BandPicker } from '@/components/bands/band-picker';
import { useBandOverlay } from '@/components/bands/band-overlay';
import { ScorePanel } from '@/components/targets/score-panel';
import { SwingVideos } from '@/components/videos/swing-videos';
import { nearestIndex } from '@/lib/signal/nearest';

const fetchSwing = fetchJson(swingViewResponseSchema);
const fetchOverview = fetchJson(recordingOverviewResponseSchema);

const MemoPhaseTable = memo(PhaseTable);
const MemoEventTable = memo(EventTable);
const MemoLabelsForm = memo(LabelsForm);
const MemoAnnotationList = memo(AnnotationList);
const MemoPhaseExplainer = memo(PhaseExplainer);
// the cursor moves on every key press and re-renders this component; the overview does not depend on it
const MemoRecordingOverview = memo(RecordingOverview);

/** `initial` is the server's first paint (events, phases); the traces and the rest arrive through the API. */
export function SwingWorkbench({ swingId, initial }: { swingId: number; initial: SwingDetail }) {
  const { data, error, mutate } = useSWR(swingUrl(swingId), fetchSwing, { revalidateOnFocus: false });
  if (!data) {
    return (
      <div className="space-y-4" data-testid="swing-workbench" data-loading="true">
        <SwingFacts swing={initial} />
        {error ? (
          <p role="alert" className="rounded-md border border-danger/30 bg-danger-soft px-4 py-3 text-sm text-danger">
            Could not load the swing’s traces: {errorText(error)}
          </p>
        ) : (
          <Skeleton className="h-[34rem] w-full" />
        )}
        <Tables swing={initial} />
      </div>
    );
  }
  return <Loaded swing={data.swing} setSwing={(swing) => mutate({ swing }, { revalidate: false })} refresh={() => void mutate()} />;
}

function Tables({ swing }: { swing: SwingDetail }) {
  return (
    <>
      <Card title="Phases">
        <MemoPhaseTable phases={swing.phases} />
        <p className="mt-3 text-sm text-ink-muted">
          COP = the centre of pressure of both feet, measured from the middle of the stance: x toward the target, y toward
          the toes (<abbr title="stance frame: origin midway between the feet">stance frame</abbr>); path is how far it travels, speed its fastest
          movement. Lead % is the share of the total load on the lead (target-side) foot. Tempo = (top − address) / (impact − top).
        </p>
      </Card>
      <Card title="Values at the events">
        <MemoEventTable events={swing.events} />
      </Card>
    </>
  );
}

function Loaded({ swing, setSwing, refresh }: { swing: SwingView; setSwing: (s: SwingView) => void; refresh: () => void }) {
  const series = useMemo(() => traceSeries(swing.series), [swing.series]);
  // the whole recording is the recording's, not the swing's: its own request, shared by every swing of the recording
  const { data: overviewData } = useSWR(`/api/recordings/${swing.recording.id}/overview`, fetchOverview, { revalidateOnFocus: false });
  const overview = overviewData?.overview ?? null;
  const whole = useMemo(() => (overview ? wholeTraceSeries(overview) : null), [overview]);
  const saved = useMemo(() => eventRecord(swing.events), [swing.events]);
  const auto = useMemo(() => eventRecord(swing.events, 'autoTimeS'), [swing.events]);
  const frames = useMemo(() => sensorFrames(swing.sensorFrames), [swing.sensorFrames]);
  const layout = useMemo(() => sensorLayout(swing.layout), [swing.layout]);
  const win = useMemo(() => ({ startS: swing.startS, endS: swing.endS }), [swing.startS, swing.endS]);
  // One time base for everything a coach reads about the swing: seconds from the saved address (address = 0 s);
  // recording seconds are the secondary detail (event table, subtitle).
  const timeZero = saved?.address ?? swing.startS;

  const [pending, setPending] = useState<SwingEvents | null>(null);
  const [viewerKey, setViewerKey] = useState(0);
  const [jumped, setJumped] = useState(false);
  const [cursor] = useState(() => createCursorStore(saved?.top ?? null));
  const [busy, setBusy] = useState(false);
  const [editError, setEditError] = useState<string | null>(null);
  const [overlayId, setOverlayId] = useState<number | null>(null);
  const { overlay, loading: overlayLoading, error: overlayError } = useOverlay(overlayId);
  const [bandId, setBandId] = useState<number | null>(null);
  const { band: leadBand, loading: bandLoading, error: bandError } = useBandOverlay(bandId);

  const moved = useMemo(() => (pending && saved ? movedEvents(saved, pending) : {}), [pending, saved]);
  const onCursorChange = useCallback((t: number) => cursor.set(t), [cursor]);
  // a playing video (or its frame keys and event buttons) moves the trace cursor and the shared cursor store
  const [videoCursor, setVideoCursor] = useState<number | null>(null);
  const onCursorFromVideo = useCallback((t: number) => {
    cursor.set(t);
    setVideoCursor(t);
  }, [cursor]);
  const leadAt = useCallback(
    (t: number) => {
      const n = series.time.length;
      if (n < 2 || t < series.time[0] || t > series.time[n - 1]) return null;
      const v = series.leadPct[nearestIndex(series.time, t)];
      return Number.isFinite(v) ? v : null;
    },
    [series],
  );
  const onEventsChange = useCallback((next: SwingEvents) => setPending(next), []);
  // a click in the overview remounts the viewer at that time (its cursor is its own state)
  const onJump = useCallback((t: number) => {
    cursor.set(t);
    setJumped(true);
    setViewerKey((k) => k + 1);
  }, [cursor]);

  const run = async (body: Parameters<typeof patchSwing>[1]) => {
    setBusy(true);
    setEditError(null);
    try {
      const res = await patchSwing(swing.id, body);
      setPending(null);
      setSwing(res.swing);
    } catch (e) {
      setEditError(errorText(e));
    } finally {
      setBusy(false);
    }
  };
  const discard = () => {
    setPending(null);
    setEditError(null);
    setViewerKey((k) => k + 1);
  };

  const canEdit = swing.canEdit;
  const usable = saved && series.time.length > 1 && swing.endS > swing.startS;
  const annotations = useMemo(() => (canEdit ? swing.annotations : swing.annotations.filter((a) => a.visibility === 'shared')), [canEdit, swing.annotations]);

  const notesBlock = (
    <div className={canEdit ? 'grid gap-3 lg:grid-cols-2' : 'space-y-3'}>
      <Card title={canEdit ? 'Notes' : 'Your coach’s notes'}>
        <MemoAnnotationList swingId={swing.id} annotations={annotations} events={saved} timeZero={timeZero} canEdit={canEdit} onChanged={refresh} />
        {canEdit && (
          <div className="mt-4 border-t border-surface-line pt-4">
            <CursorAnnotationForm swingId={swing.id} cursor={cursor} timeZero={timeZero} onChanged={refresh} />
          </div>
        )}
      </Card>
      {canEdit && (
        <Card title="Labels">
          <MemoLabelsForm key={swing.id} swingId={swing.id} labels={swing.labels} onSaved={setSwing} />
        </Card>
      )}
    </div>
  );

  return (
    <div className="space-y-3" data-testid="swing-workbench" data-can-edit={canEdit ? 'true' : 'false'}>
      <SwingFacts swing={swing} />
      {!canEdit && notesBlock}
      {canEdit && usable && (
        <EventEditBar
          swing={swing}
          moved={moved}
          timeZero={timeZero}
          busy={busy}
          error={editError}
          onSave={() => void run({ events: moved })}
          onDiscard={discard}
          onReset={() => {
            setViewerKey((k) => k + 1);
            void run({ resetEvents: 'all' });
          }}
        />
      )}
      {usable ? (
        <div className="grid gap-3 lg:grid-cols-[minmax(0,1fr)_17rem] xl:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]">
        <SwingTraceViewer
          key={viewerKey}
          series={series}
          wholeSeries={whole}
          window={win}
          events={saved}
          autoEvents={auto ?? undefined}
          layout={layout}
          handedness={swing.handedness}
          stanceWidthMm={swing.stanceWidthMm}
          sensorFrames={frames}
          overlay={overlay}
          leadBand={leadBand}
          readOnly={!canEdit}
          onEventsChange={canEdit ? onEventsChange : undefined}
          onCursorChange={onCursorChange}
          initialCursorTime={cursor.get() ?? undefined}
          externalCursorTime={videoCursor}
          initialZoom={jumped ? 'window' : undefined}
          timeZero={timeZero}
          actions={
            <span className="flex flex-wrap items-center gap-3">
              <OverlayPicker self={swing.id} value={overlayId} onChange={setOverlayId} loading={overlayLoading} />
              {canEdit && <BandPicker value={bandId} onChange={setBandId} loading={bandLoading} />}
            </span>
          }
        />
        {saved && <SwingVideos recordingId={swing.recording.id} swingId={swing.id} cursor={cursor} onCursorFromVideo={onCursorFromVideo} events={saved} leadAt={leadAt} canEdit={canEdit} />}
        </div>
      ) : (
        <p className="rounded-md border border-surface-line bg-surface px-4 py-3 text-sm text-ink-muted">This swing has no stored traces to draw (it lacks an event or its series).</p>
      )}
      {overlayError != null && <p role="alert" className="text-sm text-danger">Could not load the second swing: {errorText(overlayError)}</p>}
      {bandError != null && <p role="alert" className="text-sm text-danger">Could not load the band: {errorText(bandError)}</p>}
      {canEdit && notesBlock}
      {!canEdit && (
        <Card title="What the phases mean">
          <MemoPhaseExplainer phases={swing.phases} />
        </Card>
      )}
      {overview ? (
        <MemoRecordingOverview overview={overview} siblings={swing.siblings} window={win} onJump={onJump} recordingId={swing.recording.id} canEdit={canEdit} />
      ) : (
        <Skeleton className="h-24" />
      )}
      <Card title="Against the target">
        <ScorePanel swingId={swing.id} bandId={bandId} />
      </Card>
      <Tables swing={swing} />
      {canEdit && swing.corrections.length > 0 && (
        <Card title="Corrections">
          <CorrectionLog corrections={swing.corrections} timeZero={timeZero} />
        </Card>
      )}
    </div>
  );
}

function CursorAnnotationForm({ cursor, ...rest }: { swingId: number; cursor: CursorStore; timeZero: number; onChanged: () => void }) {
  return <AnnotationForm {...rest} cursorTime={useCursorTime(cursor)} />;
}
