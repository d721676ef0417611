import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { ShareWithStudent } from '@/components/accounts/share-with-student';
import { CoachingCaution } from '@/components/cautions/coaching-caution';
import { MinorConsentNote } from '@/components/cautions/minor-consent-note';
import { formatNumber, formatTempo } from '@/components/recordings/format';
import { clubLabels, eventLabels, flightLabels, phaseLabels, strikeLabels } from '@/components/swings/labels';
import type { SwingView } from '@/lib/contracts/swings';
import { buttonClass } from '@/components/ui/button';
import { Card, PageHeader } from '@/components/ui/card';
import { contextLabels, formatDate } from '@/components/ui/format';
import { requirePageRole } from '@/lib/auth/roles';
import { findAthleteForViewer } from '@/lib/db/athletes';
import { listSessionsForAthlete } from '@/lib/db/practice-sessions';
import { getSwingViewForViewer } from '@/lib/db/swings';
import { idParamSchema } from '@/lib/http';
import { getSessionRecordingsView } from '@/lib/recordings/views';
import { isMinor } from '@/lib/contracts/athletes';
import './print.css';
import { PrintButton } from './print-button';
import { summaryExtras } from '@/lib/swings/summary-extras';
import { SummaryTraces } from './summary-traces';

export const metadata: Metadata = { title: 'Lesson summary' };

/** Traces drawn by default: the best-rated swings, else the first ones (a summary page stays short). */
const DEFAULT_TRACES = 3;
const MAX_TRACES = 8;

function chosenIds(param: string | string[] | undefined): number[] | null {
  if (param === undefined) return null;
  const raw = (Array.isArray(param) ? param : [param]).flatMap((p) => p.split(','));
  return [...new Set(raw.map((s) => Number(s)).filter((n) => Number.isInteger(n) && n > 0))].slice(0, MAX_TRACES);
}

// The lesson on one page for the coach and the student: each swing's key numbers, the coach's notes (session notes
// and the notes shared on swings), and the chosen swings' traces as static SVG. Print-friendly (print.css).
export default async function LessonSummaryPage({ params, searchParams }: { params: Promise<{ id: string }>; searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const viewer = await requirePageRole('coach', 'student');
  const id = idParamSchema.safeParse((await params).id);
  if (!id.success) notFound();
  const view = await getSessionRecordingsView(id.data);
  if (!view) notFound();
  const athlete = await findAthleteForViewer(viewer, view.session.athleteId);
  if (!athlete) notFound();
  const session = (await listSessionsForAthlete(athlete.id)).find((s) => s.id === view.session.id);

  const swings = view.swings.filter((s) => !s.hidden && !s.stale);
  const { labels, notes } = await summaryExtras(swings.map((s) => s.id));
  const requested = chosenIds((await searchParams).swings);
  const byRating = [...swings].sort((a, b) => (labels.get(b.id)?.rating ?? 0) - (labels.get(a.id)?.rating ?? 0) || a.index - b.index);
  const chosen = (requested ?? byRating.slice(0, DEFAULT_TRACES).map((s) => s.id)).filter((sid) => swings.some((s) => s.id === sid));
  const traces: SwingView[] = await Promise.all(chosen.map((sid) => getSwingViewForViewer(viewer, sid)));
  const filename = new Map(view.recordings.map((r) => [r.id, r.filename]));
  const context = view.session.context as keyof typeof contextLabels;
  const notesBySwing = new Map<number, typeof notes>();
  for (const n of notes) notesBySwing.set(n.swingId, [...(notesBySwing.get(n.swingId) ?? []), n]);
  const swingName = (sid: number) => {
    const s = swings.find((x) => x.id === sid)!;
    return `Swing ${s.index}${view.recordings.length > 1 ? ` (${filename.get(s.recordingId)})` : ''}`;
  };
  const noteWhere = (n: (typeof notes)[number], startS: number) =>
    n.timeS !== null ? `${(n.timeS - startS).toFixed(2)} s` : n.phase ? phaseLabels[n.phase as keyof typeof phaseLabels]?.name ?? n.phase : 'whole swing';

  return (
    <div data-lesson-summary>
      <nav aria-label="Breadcrumb" className="mb-2 text-sm text-ink-muted" data-print="hide">
        <Link href={`/athletes/${athlete.id}`} className="hover:text-accent hover:underline">
          {athlete.displayName}
        </Link>{' '}
        /{' '}
        <Link href={`/sessions/${view.session.id}`} className="hover:text-accent hover:underline">
          Session
        </Link>{' '}
        / Summary
      </nav>
      <PageHeader
        title={`Lesson summary · ${athlete.displayName}`}
        subtitle={`${formatDate(view.session.sessionDate)} · ${contextLabels[context] ?? view.session.context}${view.session.location ? ` · ${view.session.location}` : ''} · ${swings.length} swings`}
        action={<PrintButton />}
      />
      <div className="space-y-5">
        <CoachingCaution />
        {viewer.role === 'coach' && <ShareWithStudent target={{ sessionId: view.session.id }} athleteId={athlete.id} athleteName={athlete.displayName} />}
        {athlete.dateOfBirth && isMinor(athlete.dateOfBirth) && <MinorConsentNote dateOfBirth={athlete.dateOfBirth} />}

        <Card title="Coach’s notes">
          {session?.notes ? <p className="whitespace-pre-wrap text-sm text-ink" data-testid="session-notes">{session.notes}</p> : <p className="text-sm text-ink-muted">No notes for the session.</p>}
          {notes.length > 0 && (
            <ul className="mt-4 space-y-2 text-sm" data-testid="summary-shared-notes">
              {swings
                .filter((s) => notesBySwing.has(s.id))
                .flatMap((s) =>
                  notesBySwing.get(s.id)!
                    .sort((a, b) => (a.timeS ?? s.events.address ?? 0) - (b.timeS ?? s.events.address ?? 0))
                    .map((n) => (
                      <li key={n.id}>
                        <span className="font-medium text-ink">{swingName(s.id)}, {noteWhere(n, s.startS)}:</span> <span className="whitespace-pre-wrap text-ink">{n.body}</span>{' '}
                        <span className="text-sm text-ink-muted">— {n.authorName}</span>
                      </li>
                    )),
                )}
            </ul>
          )}
        </Card>

        <Card title="Key numbers">
          {swings.length === 0 ? (
            <p className="text-sm text-ink-muted">No swings in this session.</p>
          ) : (
            <form method="get" className="overflow-x-auto">
              <table className="w-full text-left text-sm tabular-nums" data-testid="summary-table">
                <thead className="border-b border-surface-line text-sm text-ink-muted">
                  <tr>
                    <th scope="col" className="py-2 pr-3 font-medium" data-print="hide">Traces</th>
                    <th scope="col" className="py-2 pr-3 font-medium">Swing</th>
                    <th scope="col" className="py-2 pr-3 font-medium">Club</th>
                    <th scope="col" className="py-2 pr-3 font-medium">Strike / flight</th>
                    <th scope="col" className="py-2 pr-3 font-medium">Rating</th>
                    <th scope="col" className="py-2 pr-3 font-medium">Tempo</th>
                    <th scope="col" className="py-2 pr-3 font-medium">{eventLabels.top} → {eventLabels.impact} (s)</th>
                    <th scope="col" className="py-2 pr-3 font-medium">Lead % at impact</th>
                  </tr>
                </thead>
                <tbody className="divide-y divide-surface-line">
                  {swings.map((s) => {
                    const l = labels.get(s.id);
                    const outcome = [l?.strike ? strikeLabels[l.strike] : null, l?.flight ? flightLabels[l.flight] : null].filter(Boolean).join(' / ');
                    return (
                      <tr key={s.id} data-testid="summary-row">
                        <td className="py-1.5 pr-3" data-print="hide">
                          <input type="checkbox" name="swings" value={s.id} defaultChecked={chosen.includes(s.id)} aria-label={`Draw the traces of ${swingName(s.id)}`} />
                        </td>
                        <th scope="row" className="py-1.5 pr-3 font-medium">
                          <Link href={`/swings/${s.id}`} className="hover:text-accent hover:underline">
                            {swingName(s.id)}
                          </Link>
                        </th>
                        <td className="py-1.5 pr-3">{l?.club ? clubLabels[l.club] : '—'}</td>
                        <td className="py-1.5 pr-3">{outcome || '—'}</td>
                        <td className="py-1.5 pr-3">{l?.rating ? `${l.rating} / 5` : '—'}</td>
                        <td className="py-1.5 pr-3">{formatTempo(s.tempoRatio)}</td>
                        <td className="py-1.5 pr-3">{formatNumber(s.events.impact !== null && s.events.top !== null ? s.events.impact - s.events.top : null, 2)}</td>
                        <td className="py-1.5 pr-3">{formatNumber(s.leadPctAtImpact, 1)}</td>
                      </tr>
                    );
                  })}
                </tbody>
              </table>
              <p className="mt-3 flex items-center gap-3 text-sm text-ink-muted" data-print="hide">
                <button type="submit" className={buttonClass('secondary')}>
                  Draw the ticked swings
                </button>
                Up to {MAX_TRACES}. Tempo = (top − address) / (impact − top). Swings marked “not a swing” are left out.
              </p>
            </form>
          )}
        </Card>

        {traces.map((t) => (
          <section key={t.id} className="rounded-lg border border-surface-line bg-surface p-4" data-summary-swing={t.id}>
            <h2 className="mb-2 text-base font-semibold text-ink">
              {swingName(t.id)} <span className="text-sm font-normal text-ink-muted">· tempo {formatTempo(t.tempoRatio)}</span>
            </h2>
            <SummaryTraces swing={t} />
          </section>
        ))}
      </div>
    </div>
  );
}
