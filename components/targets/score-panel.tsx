'use client';
// The swing against its target (GET /api/swings/:id/score): pass or miss per check with by how much it misses,
// one summary line, and, when a band is chosen, time inside the band, RMS difference and CMC.
import useSWR from 'swr';
import { Badge } from '@/components/ui/badge';
import { fetchJson } from '@/lib/fetcher';
import { eventLabels, measureLabels, scoreResponseSchema, type ScoreResponse } from '@/lib/contracts/targets';

const fetchScore = fetchJson(scoreResponseSchema);

export const scoreUrl = (swingId: number, bandId: number | null) => `/api/swings/${swingId}/score${bandId != null ? `?band=${bandId}` : ''}`;

/** how far outside expected ± tolerance a value lies (0 inside); the sign says which side */
export function missBy(expected: number, tolerance: number, actual: number): number {
  const d = actual - expected;
  if (Math.abs(d) <= tolerance) return 0;
  return d > 0 ? d - tolerance : d + tolerance;
}

const fmt = (v: number | null | undefined, digits = 1) => (v == null || !Number.isFinite(v) ? '—' : v.toFixed(digits));

export function ScorePanel({ swingId, bandId }: { swingId: number; bandId: number | null }) {
  const { data, error } = useSWR(scoreUrl(swingId, bandId), fetchScore, { revalidateOnFocus: false, keepPreviousData: true });
  if (error) return <p role="alert" className="text-sm text-danger">Could not load the score: {error instanceof Error ? error.message : 'unknown error'}</p>;
  if (!data) return <p className="text-sm text-ink-muted">Scoring…</p>;
  return (
    <div className="space-y-4" data-testid="score-panel">
      <TargetChecks target={data.target} />
      {bandId != null && <BandScore band={data.band} />}
    </div>
  );
}

function TargetChecks({ target }: { target: ScoreResponse['target'] }) {
  if (!target) return <p className="text-sm text-ink-muted">No target applies to this swing (set a club label, or add a target for its club group).</p>;
  const passed = target.summary?.passed ?? target.checks.filter((c) => c.pass).length;
  const total = target.summary?.total ?? target.checks.filter((c) => c.pass != null).length;
  return (
    <div>
      <p className="mb-2 text-sm text-ink" data-testid="score-summary">
        <span className="font-semibold">{passed} of {total} checks within tolerance</span>
        {target.name ? <> against “{target.name}”</> : null}
      </p>
      <table className="w-full text-left text-sm">
        <thead className="text-sm text-ink-muted">
          <tr>
            <th className="py-1 pr-2 font-medium">Event</th>
            <th className="py-1 pr-2 font-medium">Measure</th>
            <th className="py-1 pr-2 text-right font-medium">Expected</th>
            <th className="py-1 pr-2 text-right font-medium">This swing</th>
            <th className="py-1 pr-2 font-medium">Result</th>
          </tr>
        </thead>
        <tbody>
          {target.checks.map((c) => {
            const miss = c.actual == null ? null : missBy(c.expected, c.tolerance, c.actual);
            return (
              <tr key={`${c.event}-${c.measure}`} className="border-t border-surface-line" data-check={`${c.event}.${c.measure}`} data-pass={String(c.pass)}>
                <td className="py-1 pr-2">{eventLabels[c.event]}</td>
                <td className="py-1 pr-2">{measureLabels[c.measure]}</td>
                <td className="py-1 pr-2 text-right tabular-nums">{fmt(c.expected)} ± {fmt(c.tolerance)}</td>
                <td className="py-1 pr-2 text-right tabular-nums">{fmt(c.actual)}</td>
                <td className="py-1 pr-2">
                  {c.pass == null ? (
                    <span className="text-ink-muted">not measured</span>
                  ) : c.pass ? (
                    <Badge tone="ok">✓ pass</Badge>
                  ) : (
                    <Badge tone="notice">✗ miss by {fmt(Math.abs(miss ?? 0))} {miss != null && miss > 0 ? 'high' : 'low'}</Badge>
                  )}
                </td>
              </tr>
            );
          })}
          {target.tempo && (
            <tr className="border-t border-surface-line" data-check="tempo" data-pass={String(target.tempo.pass)}>
              <td className="py-1 pr-2">Swing</td>
              <td className="py-1 pr-2">Tempo (backswing : downswing)</td>
              <td className="py-1 pr-2 text-right tabular-nums">{fmt(target.tempo.min)}–{fmt(target.tempo.max)}</td>
              <td className="py-1 pr-2 text-right tabular-nums">{fmt(target.tempo.actual, 2)}</td>
              <td className="py-1 pr-2">{target.tempo.pass == null ? '—' : target.tempo.pass ? <Badge tone="ok">✓ pass</Badge> : <Badge tone="notice">✗ outside range</Badge>}</td>
            </tr>
          )}
        </tbody>
      </table>
      <p className="mt-2 text-sm text-ink-muted">Targets are a starting point (common practice); more than one pressure style scores well, so read a miss as a question, not a fault.</p>
    </div>
  );
}

function BandScore({ band }: { band: ScoreResponse['band'] }) {
  if (!band) return <p className="text-sm text-ink-muted">The band could not be scored against this swing.</p>;
  return (
    <dl className="grid grid-cols-3 gap-3 text-sm" data-testid="band-score">
      <div>
        <dt className="text-sm text-ink-muted">Time inside band</dt>
        <dd className="font-semibold tabular-nums" data-testid="band-inside">{fmt(band.insidePct)} %</dd>
      </div>
      <div>
        <dt className="text-sm text-ink-muted">RMS difference (lead %)</dt>
        <dd className="font-semibold tabular-nums" data-testid="band-rms">{fmt(band.rms, 2)}</dd>
      </div>
      <div>
        <dt className="text-sm text-ink-muted">CMC (curve similarity, 0–1)</dt>
        <dd className="font-semibold tabular-nums" data-testid="band-cmc">{fmt(band.cmc, 3)}</dd>
      </div>
    </dl>
  );
}
