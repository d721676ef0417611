// Net review revenue per coach per month as horizontal bars, one row per coach and month (one chart per currency).
// The numbers are written beside each bar, so the chart never depends on colour or length alone.
import { formatMoney, type RevenueRow } from '@/lib/contracts/reviews';

const ROW = 36;
const LABEL_W = 260;
const BAR_W = 360;

export function RevenueChart({ rows }: { rows: RevenueRow[] }) {
  const currencies = [...new Set(rows.map((r) => r.currency))];
  return (
    <div className="space-y-6">
      {currencies.map((currency) => {
        const list = rows.filter((r) => r.currency === currency);
        const max = Math.max(1, ...list.map((r) => Math.max(0, r.netCents)));
        const height = list.length * ROW + 8;
        return (
          <figure key={currency} className="overflow-x-auto">
            <figcaption className="mb-2 text-sm font-medium text-ink">Net revenue in {currency}, per coach and month</figcaption>
            <svg width={LABEL_W + BAR_W + 140} height={height} role="img" aria-label={`Net revenue in ${currency}: ${list.map((r) => `${r.coachName} ${r.month} ${formatMoney(r.netCents, r.currency)}`).join('; ')}`}>
              {list.map((r, i) => {
                const w = Math.round((Math.max(0, r.netCents) / max) * BAR_W);
                const y = i * ROW + 4;
                return (
                  <g key={`${r.coachUserId}-${r.month}`}>
                    <text x={0} y={y + 20} fontSize={14} className="fill-ink">
                      {r.month} · {r.coachName}
                    </text>
                    <rect x={LABEL_W} y={y + 4} width={w} height={ROW - 12} className="fill-accent" />
                    <text x={LABEL_W + w + 8} y={y + 20} fontSize={14} className="fill-ink">
                      {formatMoney(r.netCents, r.currency)}
                    </text>
                  </g>
                );
              })}
            </svg>
          </figure>
        );
      })}
    </div>
  );
}
