'use client';
// The swing's videos beside the traces, on the viewer's cursor: moving the cursor (scrubbing, keys, event jumps)
// seeks every video to cursor + offset; playing a video moves the cursor to video time − offset. Up to two videos
// side by side (two camera angles). Frame steps, 1/4 and 1/2 speed, jumps to the events, the lead % at the cursor
// drawn over a corner; for the coach "This is impact" and ±1 frame nudges of the sync.
import { useCallback, useEffect, useRef, useState } from 'react';
import useSWR from 'swr';
import { videoBinnedSchema, videoListSchema, videoSchema, videoUploadedSchema, type VideoList } from '@/lib/contracts/videos';
import { deleteJson, fetchJson, sendJson } from '@/lib/fetcher';
import type { CursorStore } from '@/components/swings/cursor-store';
import { useCursorTime } from '@/components/swings/cursor-store';

const fetchVideos = fetchJson(videoListSchema);
type Item = VideoList['videos'][number];
const EVENT_WORDS: [key: 'address' | 'top' | 'transition' | 'impact' | 'finish', label: string][] = [
  ['address', 'Address'],
  ['top', 'Top'],
  ['transition', 'Start down'],
  ['impact', 'Impact'],
  ['finish', 'Finish'],
];
const SPEEDS = [
  { rate: 0.25, label: '¼×' },
  { rate: 0.5, label: '½×' },
  { rate: 1, label: '1×' },
];
const btn = 'min-h-11 min-w-11 rounded-md border border-surface-line bg-surface px-3 text-sm font-medium hover:bg-surface-muted disabled:opacity-50';

export interface SwingVideosProps {
  recordingId: number;
  swingId: number;
  cursor: CursorStore;
  /** moves the trace viewer's cursor (recording seconds) */
  onCursorFromVideo: (t: number) => void;
  events: Record<'address' | 'top' | 'transition' | 'impact' | 'finish', number>;
  /** lead % at a recording time (nearest sample), null outside the swing's series */
  leadAt: (t: number) => number | null;
  canEdit: boolean;
}

export function SwingVideos(p: SwingVideosProps) {
  const { data, error, mutate } = useSWR(`/api/recordings/${p.recordingId}/videos`, fetchVideos, { revalidateOnFocus: false, refreshInterval: (d) => (d?.videos.some((v) => v.status === 'queued' || v.status === 'processing') ? 3000 : 0) });
  if (error) return <p role="alert" className="text-sm text-danger">Could not load the videos.</p>;
  if (!data) return null;
  if (data.videos.length === 0) return p.canEdit ? <VideoUpload recordingId={p.recordingId} onDone={() => void mutate()} /> : null;
  const playable = data.videos.filter((v) => v.status === 'ready' && v.streamUrl).slice(0, 2);
  const waiting = data.videos.filter((v) => v.status === 'queued' || v.status === 'processing');
  const failed = data.videos.filter((v) => v.status === 'failed');
  return (
    <section aria-label="Video" className="space-y-2 self-start lg:sticky lg:top-2" data-testid="swing-videos">
      {waiting.length > 0 && <p className="text-sm text-ink-muted" role="status">Preparing {waiting.length} video(s) for playback…</p>}
      {failed.map((v) => (
        <p key={v.id} className="text-sm text-danger">
          “{v.filename}” could not be used: {v.error}
        </p>
      ))}
      {playable.length > 0 && <Players items={playable} {...p} onSynced={() => void mutate()} />}
      {p.canEdit && <VideoUpload recordingId={p.recordingId} onDone={() => void mutate()} />}
    </section>
  );
}

function Players({ items, onSynced, ...p }: SwingVideosProps & { items: Item[]; onSynced: () => void }) {
  const refs = useRef<(HTMLVideoElement | null)[]>([]);
  const playing = useRef(false);
  const [isPlaying, setIsPlaying] = useState(false);
  const [rate, setRate] = useState(1);
  const [status, setStatus] = useState('');
  const cursorTime = useCursorTime(p.cursor);
  const main = items[0];
  const fps = main.fps ?? 30;

  const seekAll = useCallback(
    (t: number) => {
      items.forEach((item, i) => {
        const v = refs.current[i];
        if (!v || item.offsetS === null) return;
        const target = Math.min(Math.max(0, t + item.offsetS), item.durationS ?? Infinity);
        if (Math.abs(v.currentTime - target) > 1e-4) v.currentTime = target;
      });
    },
    [items],
  );

  // cursor -> videos (not while a video drives the cursor)
  useEffect(() => {
    if (cursorTime !== null && !playing.current) seekAll(cursorTime);
  }, [cursorTime, seekAll]);

  // video -> cursor while playing, once per painted frame
  useEffect(() => {
    if (!isPlaying) return;
    let id = 0;
    const tick = () => {
      const v = refs.current[0];
      if (v && main.offsetS !== null) p.onCursorFromVideo(v.currentTime - main.offsetS);
      id = requestAnimationFrame(tick);
    };
    id = requestAnimationFrame(tick);
    return () => cancelAnimationFrame(id);
  }, [isPlaying, main.offsetS, p]);

  const playPause = () => {
    const vs = refs.current.filter((v): v is HTMLVideoElement => !!v);
    if (playing.current) {
      vs.forEach((v) => v.pause());
      playing.current = false;
      setIsPlaying(false);
    } else {
      vs.forEach((v) => {
        v.playbackRate = rate;
        void v.play().catch(() => undefined);
      });
      playing.current = true;
      setIsPlaying(true);
    }
  };
  const setSpeed = (r: number) => {
    setRate(r);
    refs.current.forEach((v) => v && (v.playbackRate = r));
  };
  const stepFrames = (n: number) => {
    const t = (p.cursor.get() ?? p.events.top) + n / fps;
    if (main.offsetS === null) {
      const v = refs.current[0];
      if (v) v.currentTime = Math.max(0, v.currentTime + n / fps);
      return;
    }
    p.onCursorFromVideo(t);
    seekAll(t);
  };
  const jump = (t: number) => {
    p.onCursorFromVideo(t);
    seekAll(t);
  };
  const thisIsImpact = async () => {
    const v = refs.current[0];
    if (!v) return;
    try {
      await sendJson(`/api/videos/${main.id}`, 'PATCH', { impact: { swingId: p.swingId, videoTimeS: v.currentTime } }, videoSchema);
      setStatus('Synced by hand: this frame is the impact.');
      onSynced();
    } catch {
      setStatus('Could not save the sync.');
    }
  };
  const nudge = async (n: number) => {
    try {
      await sendJson(`/api/videos/${main.id}`, 'PATCH', { nudgeFrames: n }, videoSchema);
      setStatus(`Sync moved ${n > 0 ? 'later' : 'earlier'} by one frame.`);
      onSynced();
    } catch {
      setStatus('Could not move the sync.');
    }
  };
  const onKeyDown = (e: React.KeyboardEvent) => {
    if (e.target instanceof HTMLButtonElement && (e.key === ' ' || e.key === 'Enter')) return;
    if (e.key === ',') stepFrames(-1);
    else if (e.key === '.') stepFrames(1);
    else if (e.key === 'k' || e.key === ' ') playPause();
    else return;
    e.preventDefault();
  };

  const lead = cursorTime === null ? null : p.leadAt(cursorTime);
  return (
    <div className="space-y-2" onKeyDown={onKeyDown}>
      <div className={items.length > 1 ? 'grid grid-cols-2 gap-2' : ''}>
        {items.map((item, i) => (
          <figure key={item.id} className="relative m-0 overflow-hidden rounded-md bg-black">
            <video
              ref={(el) => {
                refs.current[i] = el;
              }}
              src={item.streamUrl ?? undefined}
              poster={item.posterUrl ?? undefined}
              preload="auto"
              muted
              playsInline
              tabIndex={0}
              aria-label={`Video “${item.filename}”`}
              data-testid="swing-video"
              data-offset-s={item.offsetS ?? ''}
              className="block max-h-[22rem] w-full object-contain focus-visible:outline focus-visible:outline-2 focus-visible:outline-offset-2"
              onLoadedMetadata={() => {
                const t = p.cursor.get();
                if (t !== null) seekAll(t);
              }}
              onEnded={() => {
                playing.current = false;
                setIsPlaying(false);
              }}
            />
            {i === 0 && lead !== null && (
              <div className="pointer-events-none absolute left-2 top-2 w-28 rounded bg-white/90 px-2 py-1 text-sm text-ink" data-testid="video-lead-bar">
                <span className="block">Lead {Math.round(lead)} %</span>
                <span className="mt-1 block h-2 w-full bg-foot-trail" aria-hidden="true">
                  <span className="block h-2 bg-foot-lead" style={{ width: `${Math.min(100, Math.max(0, lead))}%` }} />
                </span>
              </div>
            )}
            {p.canEdit && <RemoveVideo id={item.id} filename={item.filename} onDone={onSynced} />}
            <figcaption className="px-2 py-1 text-sm text-white">
              {item.filename}
              {item.offsetS === null ? ' · not synced yet' : item.syncSource === 'audio' ? ' · synced by the impact sound' : ' · synced by hand'}
            </figcaption>
          </figure>
        ))}
      </div>
      {main.offsetS === null && main.syncNote && <p className="text-sm text-ink-muted">{main.syncNote}</p>}
      <div className="flex flex-wrap items-center gap-2" role="toolbar" aria-label="Video controls (keys: , and . step a frame, k plays)">
        <button type="button" className={btn} onClick={() => stepFrames(-1)} title="One frame back (key ,)">
          ◀ frame
        </button>
        <button type="button" className={btn} onClick={playPause} data-testid="video-play">
          {isPlaying ? 'Pause' : 'Play'}
        </button>
        <button type="button" className={btn} onClick={() => stepFrames(1)} title="One frame on (key .)">
          frame ▶
        </button>
        <span className="flex gap-1" role="group" aria-label="Speed">
          {SPEEDS.map((s) => (
            <button key={s.rate} type="button" className={btn} aria-pressed={rate === s.rate} onClick={() => setSpeed(s.rate)}>
              {s.label}
            </button>
          ))}
        </span>
        <span className="flex flex-wrap gap-1" role="group" aria-label="Go to">
          {EVENT_WORDS.map(([key, label]) => (
            <button key={key} type="button" className={btn} onClick={() => jump(p.events[key])} data-testid={`video-jump-${key}`}>
              {label}
            </button>
          ))}
        </span>
        {p.canEdit && (
          <span className="flex flex-wrap gap-1" role="group" aria-label="Sync">
            <button type="button" className={btn} onClick={() => void thisIsImpact()} data-testid="video-this-is-impact">
              This is impact
            </button>
            <button type="button" className={btn} disabled={main.offsetS === null} onClick={() => void nudge(-1)} title="Move the sync one frame earlier">
              −1 frame
            </button>
            <button type="button" className={btn} disabled={main.offsetS === null} onClick={() => void nudge(1)} title="Move the sync one frame later">
              +1 frame
            </button>
          </span>
        )}
      </div>
      <p className="text-sm text-ink-muted" role="status" aria-live="polite">
        {status}
      </p>
    </div>
  );
}

/** Adds videos of this recording's lesson (mp4, mov, webm). Film minors only with a parent's or guardian's consent. */
function VideoUpload({ recordingId, onDone }: { recordingId: number; onDone: () => void }) {
  const [message, setMessage] = useState('');
  const [busy, setBusy] = useState(false);
  const send = async (files: FileList | null) => {
    if (!files || files.length === 0) return;
    const form = new FormData();
    for (const f of Array.from(files)) form.append('file', f, f.name);
    setBusy(true);
    setMessage('Uploading…');
    try {
      const res = await fetch(`/api/recordings/${recordingId}/videos`, { method: 'POST', body: form, credentials: 'same-origin' });
      const body: unknown = await res.json();
      if (res.status !== 202) {
        setMessage((body as { error?: { message?: string } }).error?.message ?? 'The upload was refused.');
        return;
      }
      setMessage(`Received ${videoUploadedSchema.parse(body).videos.length} video(s); preparing them for playback.`);
      onDone();
    } catch {
      setMessage('The upload failed; check the connection and try again.');
    } finally {
      setBusy(false);
    }
  };
  return (
    <div className="rounded-md border border-dashed border-surface-line p-3 text-sm">
      <label className="flex min-h-11 flex-wrap items-center gap-2">
        <span className="font-medium">Add a video of this lesson</span>
        <input type="file" accept="video/mp4,video/quicktime,video/webm,.mp4,.mov,.webm" multiple disabled={busy} onChange={(e) => void send(e.target.files)} data-testid="video-upload" />
      </label>
      <p className="mt-1 text-ink-muted">mp4, mov or webm up to 1 GB. Film under-18s only with a parent’s or guardian’s consent and your club’s rules.</p>
      <p role="status" aria-live="polite">
        {message}
      </p>
    </div>
  );
}

function RemoveVideo({ id, filename, onDone }: { id: number; filename: string; onDone: () => void }) {
  const remove = async () => {
    if (!window.confirm(`Move “${filename}” to the bin? It can be restored for 30 days.`)) return;
    await deleteJson(`/api/videos/${id}`, videoBinnedSchema).catch(() => undefined);
    onDone();
  };
  return (
    <button type="button" className="absolute right-2 top-2 min-h-11 rounded bg-white/90 px-3 text-sm text-ink" onClick={() => void remove()} aria-label={`Delete video “${filename}”`}>
      Delete
    </button>
  );
}
