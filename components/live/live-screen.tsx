'use client';

import Link from 'next/link';
import { useCallback, useEffect, useRef, useState } from 'react';
import { Button } from '@/components/ui/button';
import {
  liveEndedSchema,
  liveGapSchema,
  liveLevelSchema,
  liveStatusSchema,
  liveSwingSchema,
  type LiveLevel,
  type LiveSwingEvent,
  type LiveView,
} from '@/lib/contracts/live';
import { measureLabels } from '@/lib/contracts/targets';
import { clubValues, strikeValues } from '@/lib/contracts/swings';
import { WeightBar } from './weight-bar';
import { SwingTrace } from './swing-trace';

type Phase = 'waiting' | 'streaming' | 'ended';

const CLUB_TEXT: Record<(typeof clubValues)[number], string> = {
  driver: 'Driver',
  wood: 'Wood',
  hybrid: 'Hybrid',
  'iron-3': '3i',
  'iron-4': '4i',
  'iron-5': '5i',
  'iron-6': '6i',
  'iron-7': '7i',
  'iron-8': '8i',
  'iron-9': '9i',
  wedge: 'Wedge',
};

function swingSentence(s: LiveSwingEvent): string {
  if (!s.score) return `Swing ${s.number}: found. No target applies.`;
  const missed = s.score.checks.filter((c) => !c.pass).map((c) => `${measureLabels[c.measure]} at ${c.event}`);
  if (s.score.tempo && !s.score.tempo.pass) missed.push('tempo');
  return missed.length === 0 ? `Swing ${s.number}: every check passes.` : `Swing ${s.number}: ${s.score.summary.passed} of ${s.score.summary.total} pass; missed ${missed.join(', ')}.`;
}

/** One tone when every check passes, a lower double tone when any misses (Web Audio; off unless the coach turns it on). */
function playCue(ctx: AudioContext, pass: boolean): void {
  const beep = (at: number, hz: number) => {
    const osc = ctx.createOscillator();
    const gain = ctx.createGain();
    osc.frequency.value = hz;
    gain.gain.setValueAtTime(0.0001, ctx.currentTime + at);
    gain.gain.exponentialRampToValueAtTime(0.3, ctx.currentTime + at + 0.02);
    gain.gain.exponentialRampToValueAtTime(0.0001, ctx.currentTime + at + 0.18);
    osc.connect(gain).connect(ctx.destination);
    osc.start(ctx.currentTime + at);
    osc.stop(ctx.currentTime + at + 0.2);
  };
  if (pass) beep(0, 880);
  else {
    beep(0, 330);
    beep(0.22, 330);
  }
}

export function LiveScreen({ initial }: { initial: LiveView }) {
  const id = initial.id;
  const [phase, setPhase] = useState<Phase>(initial.status === 'ended' ? 'ended' : initial.swings.length ? 'streaming' : 'waiting');
  const [statusText, setStatusText] = useState(initial.status === 'ended' ? 'Lesson ended.' : 'Waiting for the insoles.');
  const [recordingId, setRecordingId] = useState<number | null>(initial.recordingId);
  const [level, setLevel] = useState<LiveLevel | null>(null);
  const [swings, setSwings] = useState<LiveSwingEvent[]>(initial.swings);
  const [gaps, setGaps] = useState<number[]>([]);
  const [announce, setAnnounce] = useState('');
  const [sound, setSound] = useState(false);
  const [wake, setWake] = useState<'on' | 'unavailable' | 'off'>('off');
  const [token, setToken] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const audio = useRef<AudioContext | null>(null);
  const soundRef = useRef(false);
  soundRef.current = sound;

  useEffect(() => setToken(sessionStorage.getItem(`stanceline-live-token-${id}`)), [id]);

  // the event stream; EventSource sends Last-Event-ID itself when it reconnects
  useEffect(() => {
    if (initial.status === 'ended') return;
    const es = new EventSource(`/api/live/${id}/events`);
    es.addEventListener('level', (e) => setLevel(liveLevelSchema.parse(JSON.parse((e as MessageEvent).data))));
    es.addEventListener('swing', (e) => {
      const s = liveSwingSchema.parse(JSON.parse((e as MessageEvent).data));
      setPhase('streaming');
      setSwings((prev) => (prev.some((p) => p.swingId === s.swingId) ? prev : [...prev, s]));
      setAnnounce(swingSentence(s));
      if (soundRef.current && audio.current && s.score) playCue(audio.current, s.score.summary.passed === s.score.summary.total);
    });
    es.addEventListener('gap', (e) => setGaps(liveGapSchema.parse(JSON.parse((e as MessageEvent).data)).missing));
    es.addEventListener('status', (e) => {
      const st = liveStatusSchema.parse(JSON.parse((e as MessageEvent).data));
      setPhase(st.status);
      setStatusText(st.message);
      if (st.recordingId !== null) setRecordingId(st.recordingId);
      if (st.status === 'ended') es.close();
    });
    return () => es.close();
  }, [id, initial.status]);

  // the screen stays on during the lesson (Screen Wake Lock API where the browser has it)
  useEffect(() => {
    if (phase === 'ended') return;
    let lock: WakeLockSentinel | null = null;
    let cancelled = false;
    const take = async () => {
      if (!('wakeLock' in navigator)) return setWake('unavailable');
      try {
        lock = await navigator.wakeLock.request('screen');
        if (!cancelled) setWake('on');
      } catch {
        if (!cancelled) setWake('unavailable');
      }
    };
    void take();
    const again = () => document.visibilityState === 'visible' && void take();
    document.addEventListener('visibilitychange', again);
    return () => {
      cancelled = true;
      document.removeEventListener('visibilitychange', again);
      void lock?.release().catch(() => undefined);
    };
  }, [phase]);

  const post = useCallback(async (path: string, init: RequestInit = { method: 'POST' }) => {
    setError(null);
    const res = await fetch(path, init);
    const body = await res.json().catch(() => null);
    if (!res.ok) setError(body?.error?.message ?? 'That did not work.');
    return { ok: res.ok, body };
  }, []);

  const label = async (s: LiveSwingEvent, patch: Record<string, unknown>) => {
    const r = await post(`/api/live/${id}/swings/${s.number}`, { method: 'PATCH', headers: { 'content-type': 'application/json' }, body: JSON.stringify(patch) });
    if (r.ok) {
      const updated = liveSwingSchema.parse(r.body.swing);
      setSwings((prev) => prev.map((p) => (p.swingId === updated.swingId ? updated : p)));
    }
  };

  const last = swings.length ? swings[swings.length - 1] : null;
  const counted = swings.filter((s) => !s.labels.notSwing).length;

  return (
    <div className="space-y-4" data-testid="live-screen">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <div>
          <h1 className="text-2xl font-semibold text-ink">Live · {initial.athleteName}</h1>
          <p className="text-base text-ink-muted" data-testid="live-status">
            {statusText}
            {phase !== 'ended' && (wake === 'on' ? ' Screen kept awake.' : wake === 'unavailable' ? ' This browser may let the screen sleep.' : '')}
          </p>
        </div>
        <div className="flex flex-wrap gap-2">
          <Button
            variant="secondary"
            className="min-h-11"
            aria-pressed={sound}
            onClick={() => {
              audio.current ??= new AudioContext();
              void audio.current.resume();
              setSound((v) => !v);
            }}
          >
            {sound ? 'Sound cue: on' : 'Sound cue: off'}
          </Button>
          {phase !== 'ended' && !swings.length && (
            <Button variant="secondary" className="min-h-11" onClick={() => void post(`/api/live/${id}/demo-bridge`).then((r) => r.ok && setStatusText(`Demo bridge: replaying ${r.body.filename}.`))}>
              Start demo bridge
            </Button>
          )}
          {phase !== 'ended' && (
            <Button
              className="min-h-11"
              onClick={async () => {
                const r = await post(`/api/live/${id}/end`);
                if (r.ok) {
                  setRecordingId(liveEndedSchema.parse(r.body).recordingId);
                  setPhase('ended');
                  setStatusText('Lesson ended; the recording is being analysed.');
                }
              }}
            >
              End lesson
            </Button>
          )}
        </div>
      </div>

      <p role="status" aria-live="polite" className="sr-only" data-testid="live-announce">
        {announce}
      </p>
      {error && (
        <p role="alert" className="text-base text-danger">
          {error}
        </p>
      )}
      {gaps.length > 0 && phase !== 'ended' && (
        <p className="rounded-md border border-notice-line bg-notice-soft px-3 py-2 text-base text-notice" data-testid="live-gap">
          Waiting for missing data from the insoles (chunk{gaps.length > 1 ? 's' : ''} {gaps.slice(0, 5).join(', ')}
          {gaps.length > 5 ? '…' : ''}). Swings after it appear once it arrives.
        </p>
      )}
      {phase === 'ended' && recordingId !== null && (
        <p className="text-base">
          The whole lesson is now a recording in{' '}
          <Link className="font-medium text-accent-strong underline" href={`/sessions/${initial.sessionId}`}>
            this session
          </Link>
          ; live labels move to the final swings once it is analysed.
        </p>
      )}

      <WeightBar level={level} />

      {last ? (
        <SwingCard swing={last} count={counted} drillFocus={initial.drillFocus} band={initial.band} onLabel={(p) => void label(last, p)} />
      ) : (
        <section className="rounded-lg border border-surface-line bg-surface p-6 text-lg text-ink-muted">
          No swing yet. The card appears here right after each finish.
          {initial.drillFocus && <span className="block pt-2 text-ink">Drill in focus: {initial.drillFocus}</span>}
        </section>
      )}

      {swings.length > 1 && (
        <section aria-label="Earlier swings" className="rounded-lg border border-surface-line bg-surface p-4">
          <h2 className="text-base font-semibold">Earlier swings</h2>
          <ol className="mt-2 flex flex-wrap gap-2 text-base">
            {swings
              .slice(0, -1)
              .reverse()
              .map((s) => (
                <li key={s.swingId} className="rounded-md border border-surface-line px-3 py-2">
                  {s.number}. {s.score ? (s.score.summary.passed === s.score.summary.total ? '✓ all pass' : `✗ ${s.score.summary.passed}/${s.score.summary.total}`) : '—'}
                  {s.labels.notSwing ? ' · not a swing' : ''}
                </li>
              ))}
          </ol>
        </section>
      )}

      {token && phase !== 'ended' && (
        <details className="rounded-md border border-surface-line bg-surface px-4 py-2 text-sm">
          <summary className="min-h-11 cursor-pointer py-2 font-medium">Connect the insoles’ bridge</summary>
          <p className="py-1">Samples go to this address with this token (valid until the lesson ends):</p>
          <code className="block break-all rounded bg-surface-sunken p-2">POST {typeof window === 'undefined' ? '' : window.location.origin}/api/live/{id}/samples</code>
          <code className="mt-1 block break-all rounded bg-surface-sunken p-2">Authorization: Bearer {token}</code>
        </details>
      )}
    </div>
  );
}

function SwingCard({
  swing,
  count,
  drillFocus,
  band,
  onLabel,
}: {
  swing: LiveSwingEvent;
  count: number;
  drillFocus: string | null;
  band: LiveView['band'];
  onLabel: (patch: Record<string, unknown>) => void;
}) {
  const a = swing.values.atEvents;
  const tempo = swing.score?.tempo ?? null;
  const pill = (pressed: boolean) =>
    `min-h-11 min-w-11 rounded-md border px-3 text-base font-medium ${pressed ? 'border-accent bg-accent text-white' : 'border-surface-line bg-surface text-ink hover:bg-surface-sunken'}`;
  return (
    <section aria-label={`Swing ${swing.number}`} data-testid="live-swing-card" className="rounded-lg border-2 border-ink bg-surface p-5">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 className="text-3xl font-semibold">Swing {swing.number}</h2>
        <p className="text-lg text-ink-muted">
          {count} swing{count === 1 ? '' : 's'} this lesson{drillFocus ? ` · Drill: ${drillFocus}` : ''}
        </p>
      </div>

      <div className="mt-4 grid gap-6 lg:grid-cols-[1fr_1fr]">
        <div>
          <dl className="grid grid-cols-2 gap-3 sm:grid-cols-4">
            {(
              [
                ['Lead % at top', a.top.leadPct],
                ['at impact', a.impact.leadPct],
                ['at finish', a.finish.leadPct],
              ] as const
            ).map(([k, v]) => (
              <div key={k}>
                <dt className="text-base text-ink-muted">{k}</dt>
                <dd className="text-5xl font-semibold tabular-nums text-foot-lead-ink">{Math.round(v)}%</dd>
              </div>
            ))}
            <div>
              <dt className="text-base text-ink-muted">Tempo</dt>
              <dd className="text-5xl font-semibold tabular-nums">{swing.values.tempoRatio.toFixed(1)}:1</dd>
            </div>
          </dl>
          {swing.score ? (
            <ul className="mt-4 space-y-2" aria-label={`Checks against ${swing.score.targetName}`}>
              {swing.score.checks.map((c) => (
                <li key={`${c.event}-${c.measure}`} className={`flex items-center gap-3 rounded-md border px-3 py-2 text-xl ${c.pass ? 'border-ok bg-ok-soft text-ok' : 'border-danger bg-danger-soft text-danger'}`}>
                  <span aria-hidden="true" className="text-2xl font-bold">
                    {c.pass ? '✓' : '✗'}
                  </span>
                  <span className="font-semibold">{c.pass ? 'pass' : 'miss'}</span>
                  <span className="text-ink">
                    {measureLabels[c.measure]} at {c.event}: {c.actual === null ? '—' : Math.round(c.actual)} (aim {c.expected} ± {c.tolerance})
                  </span>
                </li>
              ))}
              {tempo && (
                <li className={`flex items-center gap-3 rounded-md border px-3 py-2 text-xl ${tempo.pass ? 'border-ok bg-ok-soft text-ok' : 'border-danger bg-danger-soft text-danger'}`}>
                  <span aria-hidden="true" className="text-2xl font-bold">
                    {tempo.pass ? '✓' : '✗'}
                  </span>
                  <span className="font-semibold">{tempo.pass ? 'pass' : 'miss'}</span>
                  <span className="text-ink">
                    Tempo {tempo.actual === null ? '—' : tempo.actual.toFixed(1)} (aim {tempo.min}–{tempo.max})
                  </span>
                </li>
              )}
            </ul>
          ) : (
            <p className="mt-4 text-base text-ink-muted">No target applies to this student yet.</p>
          )}
          {swing.score?.commonPractice && <p className="mt-2 text-sm text-ink-muted">Target from common practice, not a published standard; adjust it per player.</p>}
        </div>
        <SwingTrace swing={swing} band={band} />
      </div>

      <div className="mt-5 space-y-3" aria-label="Labels for this swing">
        <div className="flex flex-wrap items-center gap-2">
          <span className="w-16 text-base font-medium">Club</span>
          {clubValues.map((c) => (
            <button key={c} type="button" aria-pressed={swing.labels.club === c} className={pill(swing.labels.club === c)} onClick={() => onLabel({ club: swing.labels.club === c ? null : c })}>
              {CLUB_TEXT[c]}
            </button>
          ))}
        </div>
        <div className="flex flex-wrap items-center gap-2">
          <span className="w-16 text-base font-medium">Strike</span>
          {strikeValues.map((s) => (
            <button key={s} type="button" aria-pressed={swing.labels.strike === s} className={pill(swing.labels.strike === s)} onClick={() => onLabel({ strike: swing.labels.strike === s ? null : s })}>
              {s}
            </button>
          ))}
          <button type="button" aria-pressed={swing.labels.notSwing} className={`${pill(swing.labels.notSwing)} ml-auto`} onClick={() => onLabel({ notSwing: !swing.labels.notSwing })}>
            Not a swing
          </button>
        </div>
      </div>
    </section>
  );
}
