// One chosen swing's traces as static SVG for the lesson summary: lead share, heel share and COP speed on the
// swing's time axis plus the COP path over the insoles. Rendered on the server (no cursor, no table fallback,
// the numbers are in the summary's table).
// Imported from their own modules: the charts index also re-exports client-only components.
import { StancePathChart } from '@/components/charts/stance-path-chart';
import { HeelShareChart, LeadShareChart } from '@/components/charts/swing-charts';
import { phaseLabels } from '@/components/swings/labels';
import type { SwingView } from '@/lib/contracts/swings';
import { eventRecord, sensorLayout, traceSeries } from '@/components/swings/swing-view-model';

const CHART_W = 640;
/** Quarter of a second either side of address and finish, as the viewer's default zoom. */
const MARGIN_S = 0.25;

export function SummaryTraces({ swing }: { swing: SwingView }) {
  const events = eventRecord(swing.events);
  const series = traceSeries(swing.series);
  if (!events || series.time.length < 2) return <p className="text-sm text-ink-muted">No traces stored for this swing.</p>;
  const t = series.time;
  const domain: [number, number] = [Math.max(t[0], events.address - MARGIN_S), Math.min(t[t.length - 1], events.finish + MARGIN_S)];
  const corrected = Object.fromEntries(swing.events.map((e) => [e.name, e.source === 'manual']));
  const common = { series, domain, width: CHART_W, events, corrected, timeZero: swing.startS, table: false, idPrefix: `summary-${swing.id}` } as const;
  return (
    <div className="flex flex-wrap items-start gap-4" data-summary-traces={swing.id}>
      <div className="min-w-0 space-y-1" style={{ width: CHART_W }}>
        <LeadShareChart {...common} height={150} />
        <HeelShareChart {...common} height={110} />
      </div>
      <div style={{ width: 240 }}>
        <StancePathChart
          series={series}
          domain={domain}
          layout={sensorLayout(swing.layout)}
          handedness={swing.handedness}
          stanceWidthMm={swing.stanceWidthMm}
          width={240}
          events={events}
          timeZero={swing.startS}
          table={false}
          idPrefix={`summary-${swing.id}`}
        />
        <ul className="mt-2 space-y-0.5 text-sm text-ink-muted">
          {swing.phases.map((p) => (
            <li key={p.name}>
              {phaseLabels[p.name].name}: {p.durationS == null ? '—' : `${p.durationS.toFixed(2)} s`}, mean lead {p.meanLeadPct == null ? '—' : `${p.meanLeadPct.toFixed(0)} %`}
            </li>
          ))}
        </ul>
      </div>
    </div>
  );
}
