'use client';
// The whole recording at low resolution (lead % over time) with this swing's window marked. A click inside the
// window moves the viewer's cursor there; a click before or after it opens the previous or next swing. Moves the
// swing finder did not count are dashed marks, listed below with the reason; a coach can count one as a swing.
import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { scaleLinear } from 'd3';
import { useState, type MouseEvent } from 'react';
import { CHART_COLOURS, TONE_STYLE } from '@/components/charts/lib/palette';
import { linePath } from '@/components/charts/lib/paths';
import type { RecordingOverview as OverviewData, SwingView } from '@/lib/contracts/swings';

const W = 1000;
const H = 40;

export interface RecordingOverviewProps {
  overview: OverviewData;
  siblings: SwingView['siblings'];
  window: { startS: number; endS: number };
  onJump: (t: number) => void;
  /** with these, a coach can count a rejected candidate as a swing */
  recordingId?: number;
  canEdit?: boolean;
}

export function RecordingOverview({ overview, siblings, window: win, onJump, recordingId, canEdit }: RecordingOverviewProps) {
  const router = useRouter();
  const candidates = overview.candidates ?? [];
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

  const link = 'rounded-md border border-surface-line px-2.5 py-1 text-sm text-ink hover:bg-surface-sunken';
  return (
    <section aria-label="Recording overview" className="rounded-lg border border-surface-line bg-surface px-3 py-2" data-testid="recording-overview">
      <div className="mb-1 flex items-center gap-3 text-sm text-ink-muted">
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
        {candidates.map((c) => (
          <line key={c.timeS} x1={x(c.timeS)} x2={x(c.timeS)} y1={2} y2={H - 2} stroke={CHART_COLOURS.line} strokeDasharray="2 2" strokeOpacity={0.7} vectorEffect="non-scaling-stroke" data-testid="candidate-mark">
            <title>{`${c.timeS.toFixed(2)} s, not counted: ${c.reasonText}`}</title>
          </line>
        ))}
      </svg>
      {candidates.length > 0 && <CandidateList candidates={candidates} recordingId={recordingId} canEdit={Boolean(canEdit)} />}
    </section>
  );
}

type Candidate = NonNullable<OverviewData['candidates']>[number];

/** The moves not counted as swings (dashed marks above), each with its reason; a coach may count one. */
function CandidateList({ candidates, recordingId, canEdit }: { candidates: Candidate[]; recordingId?: number; canEdit: boolean }) {
  const [state, setState] = useState<{ busy: number | null; message: string | null }>({ busy: null, message: null });
  const promote = async (timeS: number) => {
    if (recordingId === undefined) return;
    setState({ busy: timeS, message: null });
    try {
      const res = await fetch(`/api/recordings/${recordingId}/candidates/promote`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ timeS }),
      });
      const body = (await res.json().catch(() => ({}))) as { error?: { message?: string; fieldErrors?: Record<string, string[]> } };
      setState({
        busy: null,
        message: res.ok ? `Counted the move at ${timeS.toFixed(2)} s as a swing; the recording is being analysed again (reload in a moment).` : (body.error?.fieldErrors?.timeS?.[0] ?? body.error?.message ?? `Could not count it (${res.status}).`),
      });
    } catch {
      setState({ busy: null, message: 'Could not reach the server.' });
    }
  };
  return (
    <details className="mt-1 text-sm text-ink-muted" data-testid="candidate-list">
      <summary className="cursor-pointer">Moves not counted as swings ({candidates.length}), dashed above</summary>
      <ul className="mt-1 space-y-1">
        {candidates.map((c) => (
          <li key={c.timeS} className="flex flex-wrap items-center gap-x-3">
            <span className="tabular-nums">{c.timeS.toFixed(2)} s</span>
            <span>{c.reasonText}</span>
            {canEdit && recordingId !== undefined && (
              <button type="button" className="min-h-11 rounded-md border border-surface-line px-3 py-1 text-ink hover:bg-surface-sunken disabled:opacity-50" disabled={state.busy !== null} onClick={() => promote(c.timeS)} data-testid="promote-candidate">
                Count this as a swing
              </button>
            )}
          </li>
        ))}
      </ul>
      {state.message && (
        <p role="status" className="mt-1 text-ink">
          {state.message}
        </p>
      )}
    </details>
  );
}
