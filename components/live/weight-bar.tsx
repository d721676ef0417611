import type { LiveLevel } from '@/lib/contracts/live';

// The live weight between the feet (trail on the left, lead on the right, as the coach faces the student's chest
// for a right-handed player) and a heel-to-toe gauge per foot. Numbers are written out beside every shape.
export function WeightBar({ level }: { level: LiveLevel | null }) {
  const lead = level?.leadPct ?? null;
  return (
    <section aria-label="Weight now" className="rounded-lg border border-surface-line bg-surface p-4" data-testid="live-weight">
      <div className="flex items-end justify-between text-lg font-semibold">
        <span className="text-foot-trail-ink">Trail {lead === null ? '—' : `${Math.round(100 - lead)}%`}</span>
        <span className="text-foot-lead-ink">Lead {lead === null ? '—' : `${Math.round(lead)}%`}</span>
      </div>
      <div className="relative mt-2 h-10 overflow-hidden rounded-md border border-ink-faint bg-surface-sunken" role="img" aria-label={lead === null ? 'No data yet' : `Lead foot ${Math.round(lead)} percent`}>
        {lead !== null && (
          <>
            <div className="absolute inset-y-0 left-0 bg-foot-trail" style={{ width: `${100 - lead}%` }} />
            <div className="absolute inset-y-0 right-0 bg-foot-lead" style={{ width: `${lead}%` }} />
          </>
        )}
        <div className="absolute inset-y-0 left-1/2 w-0.5 bg-ink" aria-hidden="true" />
      </div>
      <div className="mt-3 grid grid-cols-2 gap-4 text-base">
        <HeelToe label="Trail foot" heel={level?.trailHeelPct ?? null} />
        <HeelToe label="Lead foot" heel={level?.leadHeelPct ?? null} />
      </div>
    </section>
  );
}

function HeelToe({ label, heel }: { label: string; heel: number | null }) {
  return (
    <div className="flex items-center gap-3">
      <span className="w-24 font-medium">{label}</span>
      <span className="text-ink-muted">heel</span>
      <div className="relative h-4 flex-1 rounded-full border border-ink-faint bg-surface-sunken" aria-hidden="true">
        {heel !== null && <div className="absolute top-1/2 h-6 w-2 -translate-y-1/2 rounded-sm bg-ink" style={{ left: `calc(${100 - heel}% - 4px)` }} />}
      </div>
      <span className="text-ink-muted">toe</span>
      <span className="w-24 tabular-nums">{heel === null ? '—' : `${Math.round(heel)}% heel`}</span>
    </div>
  );
}
