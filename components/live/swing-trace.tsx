import type { LiveSwingEvent, LiveView } from '@/lib/contracts/live';

// The last swing's lead % from just before address to the finish, with the event times marked and, when the coach
// has built one for this player, the player's band (address -> finish on a 0-100 % axis) behind it.
export function SwingTrace({ swing, band }: { swing: LiveSwingEvent; band: LiveView['band'] }) {
  const W = 360;
  const H = 160;
  const { t0, dt, leadPct } = swing.trace;
  const t1 = t0 + dt * Math.max(1, leadPct.length - 1);
  const x = (t: number) => ((t - t0) / (t1 - t0)) * W;
  const y = (v: number) => H - (v / 100) * H;
  const path = leadPct.map((v, i) => `${i ? 'L' : 'M'}${x(t0 + i * dt).toFixed(1)},${y(v).toFixed(1)}`).join('');
  const ax = x(swing.events.address);
  const fx = x(swing.events.finish);
  const bandPath = (values: number[]) => values.map((v, i) => `${i ? 'L' : 'M'}${(ax + ((fx - ax) * i) / Math.max(1, values.length - 1)).toFixed(1)},${y(v).toFixed(1)}`).join('');
  return (
    <figure className="m-0">
      <svg viewBox={`0 0 ${W} ${H + 20}`} className="w-full" role="img" aria-label={`Lead % over swing ${swing.number}, from address to finish${band ? `, against the band ${band.name}` : ''}`}>
        <line x1={0} x2={W} y1={y(50)} y2={y(50)} className="stroke-ink-faint" strokeDasharray="4 4" />
        {band && (
          <>
            <path d={`${bandPath(band.upper)}L${bandPath([...band.lower].reverse()).slice(1)}Z`} className="fill-band-soft" />
            <path d={bandPath(band.mean)} className="fill-none stroke-band-edge" strokeDasharray="6 3" strokeWidth={2} />
          </>
        )}
        <path d={path} className="fill-none stroke-foot-lead" strokeWidth={3} />
        {(['address', 'top', 'impact', 'finish'] as const).map((e) => (
          <g key={e}>
            <line x1={x(swing.events[e])} x2={x(swing.events[e])} y1={0} y2={H} className="stroke-ink-muted" strokeWidth={1} />
            <text x={x(swing.events[e]) + (e === 'finish' ? -2 : 2)} y={H + 16} textAnchor={e === 'finish' ? 'end' : 'start'} className="fill-ink text-[12px]">
              {e}
            </text>
          </g>
        ))}
      </svg>
      <figcaption className="text-sm text-ink-muted">Lead % (solid line); dashed middle line is 50/50{band ? '; shaded: the player’s band' : ''}.</figcaption>
    </figure>
  );
}
