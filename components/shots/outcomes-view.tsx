'use client';
// "What goes with distance": every pressure measure against the chosen result for one player (and club), ranked by
// the strength of the straight-line relation, and the scatter of the chosen measure.
import { useState } from 'react';
import useSWR from 'swr';
import { Card } from '@/components/ui/card';
import { inputClass } from '@/components/ui/field';
import { fetchJson } from '@/lib/fetcher';
import { OUTCOMES, outcomeSessionsResponseSchema, outcomesResponseSchema, rankingResponseSchema, type MetricId, type Outcome, type UnitSystem } from '@/lib/contracts/shots';
import { formatOutcome, METRIC_HELP, METRIC_LABELS, OUTCOME_LABELS, outcomeUnit, outcomeValue } from './shot-format';
import { OutcomeScatter } from './outcome-scatter';

const fetchRanking = fetchJson(rankingResponseSchema);
const fetchOutcomes = fetchJson(outcomesResponseSchema);
const fetchSessions = fetchJson(outcomeSessionsResponseSchema);

/** Fewer shots than this say little about a relation (common practice; the note says so beside the numbers). */
export const FEW_SHOTS = 10;

const fmtR = (v: number | null) => (v === null ? '–' : v.toFixed(2));
const fmtP = (v: number | null) => (v === null ? '–' : v < 0.001 ? '< 0.001' : v.toFixed(3));

export function OutcomesView({ athleteId, units }: { athleteId: number; units: UnitSystem }) {
  const [outcome, setOutcome] = useState<Outcome>('carry');
  const [club, setClub] = useState('');
  const [from, setFrom] = useState('');
  const [to, setTo] = useState('');
  const [metric, setMetric] = useState<MetricId | null>(null);
  const filters = `outcome=${outcome}&club=${encodeURIComponent(club)}&from=${from}&to=${to}`;
  const { data: ranking, error } = useSWR(`/api/athletes/${athleteId}/outcomes/ranking?${filters}`, fetchRanking);
  const chosen = metric ?? ranking?.rows.find((r) => r.r !== null)?.metric ?? null;
  const { data: detail } = useSWR(chosen ? `/api/athletes/${athleteId}/outcomes?metric=${chosen}&${filters}` : null, fetchOutcomes);
  const { data: bySession } = useSWR(`/api/athletes/${athleteId}/outcomes/sessions?club=${encodeURIComponent(club)}&from=${from}&to=${to}`, fetchSessions);
  const n = ranking?.rows.reduce((m, r) => Math.max(m, r.n), 0) ?? 0;
  const yLabel = `${OUTCOME_LABELS[outcome]} (${outcomeUnit(outcome, units)})`;

  return (
    <div className="space-y-4">
      <aside role="note" className="rounded-md border border-notice-line bg-notice-soft p-3 text-sm text-notice" data-testid="correlation-note">
        <p>
          <span className="font-semibold">These numbers show what went together, not what caused what.</span> A measure that rises with carry may
          share a cause with it (a better strike, a different club, fatigue). Try a change before concluding it helps, and keep drills
          within what the player&apos;s body allows.
        </p>
        <p className="mt-1">Fewer than {FEW_SHOTS} shots say little: the range of r (95 % interval) shows how unsure a value is.</p>
      </aside>
      <Card title="What goes with the result">
        <div className="mb-4 flex flex-wrap items-end gap-3">
          <label className="text-sm font-medium text-ink">
            Result
            <select className={`${inputClass} mt-1 min-h-11`} value={outcome} onChange={(e) => { setOutcome(e.target.value as Outcome); setMetric(null); }} data-testid="outcome-select">
              {OUTCOMES.map((o) => (
                <option key={o} value={o}>
                  {OUTCOME_LABELS[o]}
                </option>
              ))}
            </select>
          </label>
          <label className="text-sm font-medium text-ink">
            Club
            <select className={`${inputClass} mt-1 min-h-11`} value={club} onChange={(e) => setClub(e.target.value)} data-testid="club-select">
              <option value="">All clubs</option>
              {ranking?.clubs.map((c) => (
                <option key={c} value={c}>
                  {c}
                </option>
              ))}
            </select>
          </label>
          <label className="text-sm font-medium text-ink">
            From
            <input type="date" className={`${inputClass} mt-1 min-h-11`} value={from} onChange={(e) => setFrom(e.target.value)} />
          </label>
          <label className="text-sm font-medium text-ink">
            To
            <input type="date" className={`${inputClass} mt-1 min-h-11`} value={to} onChange={(e) => setTo(e.target.value)} />
          </label>
        </div>
        {error && <p role="alert" className="text-sm text-danger">{String(error.message ?? error)}</p>}
        {ranking && n === 0 && <p className="text-sm text-ink-muted">No shots are paired with swings for these choices yet. Import a shot log on a session page.</p>}
        {ranking && n > 0 && (
          <>
            {n < FEW_SHOTS && (
              <p className="mb-2 text-sm font-medium text-notice" data-testid="few-shots">
                Only {n} shots: treat every number here as a hint at most.
              </p>
            )}
            <div className="overflow-x-auto">
              <table className="w-full text-left text-sm" data-testid="ranking-table">
                <caption className="sr-only">Pressure measures ranked by how closely they go with {OUTCOME_LABELS[outcome]}</caption>
                <thead className="text-ink-muted">
                  <tr>
                    <th scope="col" className="py-2 pr-3">Pressure measure</th>
                    <th scope="col" className="py-2 pr-3">Shots</th>
                    <th scope="col" className="py-2 pr-3" title="Pearson's correlation coefficient r with its 95 % interval (Fisher's z)">Goes with it (r, 95 % range)</th>
                    <th scope="col" className="py-2 pr-3" title="Spearman's rank correlation rho">By rank (rho)</th>
                    <th scope="col" className="py-2 pr-3" title="p value adjusted for testing all measures at once (Benjamini-Hochberg)">Chance finding? (adjusted p)</th>
                  </tr>
                </thead>
                <tbody>
                  {ranking.rows.map((r) => (
                    <tr key={r.metric} className={`border-t border-surface-line ${r.metric === chosen ? 'bg-surface-sunken' : ''}`}>
                      <td className="py-1 pr-3">
                        <button type="button" className="min-h-11 text-left text-accent underline" aria-pressed={r.metric === chosen} onClick={() => setMetric(r.metric)} title={METRIC_HELP[r.metric]}>
                          {METRIC_LABELS[r.metric]}
                        </button>
                      </td>
                      <td className="py-1 pr-3">{r.n}</td>
                      <td className="py-1 pr-3">
                        {fmtR(r.r)} {r.rLow !== null && r.rHigh !== null && <span className="text-ink-muted">({fmtR(r.rLow)} to {fmtR(r.rHigh)})</span>}
                      </td>
                      <td className="py-1 pr-3">{fmtR(r.rho)}</td>
                      <td className="py-1 pr-3">{fmtP(r.pAdjusted)}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          </>
        )}
      </Card>
      {chosen && detail && (
        <Card title={`${OUTCOME_LABELS[outcome]} against ${METRIC_LABELS[chosen].toLowerCase()}`}>
          <p className="mb-2 text-sm text-ink" data-testid="scatter-summary">
            {detail.n} shots · r = {fmtR(detail.r)}
            {detail.rLow !== null && detail.rHigh !== null ? ` (95 % range ${fmtR(detail.rLow)} to ${fmtR(detail.rHigh)})` : ''} · rho = {fmtR(detail.rho)}
          </p>
          <OutcomeScatter
            xLabel={METRIC_LABELS[chosen]}
            yLabel={yLabel}
            points={detail.points.map((p) => ({ ...p, y: outcomeValue(outcome, p.y, units) }))}
            slope={detail.slope === null ? null : outcomeValue(outcome, detail.slope, units)}
            intercept={detail.intercept === null ? null : outcomeValue(outcome, detail.intercept, units)}
          />
        </Card>
      )}
      {bySession && bySession.sessions.length > 0 && (
        <Card title="Session by session">
          <div className="overflow-x-auto">
            <table className="w-full text-left text-sm" data-testid="outcome-sessions">
              <caption className="sr-only">Mean results of the paired shots per session, next to pressure measures</caption>
              <thead className="text-ink-muted">
                <tr>
                  <th scope="col" className="py-2 pr-3">Session</th>
                  <th scope="col" className="py-2 pr-3">Shots</th>
                  <th scope="col" className="py-2 pr-3">Ball speed ({outcomeUnit('ball_speed', units)})</th>
                  <th scope="col" className="py-2 pr-3">Carry ({outcomeUnit('carry', units)})</th>
                  <th scope="col" className="py-2 pr-3">Lead foot % at impact</th>
                  <th scope="col" className="py-2 pr-3">Tempo</th>
                </tr>
              </thead>
              <tbody>
                {bySession.sessions.map((s) => (
                  <tr key={s.sessionId} className="border-t border-surface-line">
                    <td className="py-1.5 pr-3">
                      <a className="text-accent underline" href={`/sessions/${s.sessionId}`}>
                        {s.date} · {s.context}
                      </a>
                    </td>
                    <td className="py-1.5 pr-3">{s.shots}</td>
                    <td className="py-1.5 pr-3">{formatOutcome('ball_speed', s.ballSpeed, units)}</td>
                    <td className="py-1.5 pr-3">{formatOutcome('carry', s.carry, units)}</td>
                    <td className="py-1.5 pr-3">{s.leadPctAtImpact === null ? '–' : s.leadPctAtImpact.toFixed(1)}</td>
                    <td className="py-1.5 pr-3">{s.tempoRatio === null ? '–' : `${s.tempoRatio.toFixed(1)} : 1`}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <p className="mt-2 text-sm text-ink-muted">Means per session; a session with a few shots moves a lot by chance.</p>
        </Card>
      )}
    </div>
  );
}
