import { CHART_COLOURS, OVERLAY_STYLE, TONE_STYLE } from './lib/palette';
import type { LineTone } from './lib/types';

export interface LegendItem {
  label: string;
  tone: LineTone | 'band';
  overlay?: boolean;
}

/** A line sample drawn with the same colour and dash as the trace, then its words: never colour alone. */
function Swatch({ tone, overlay }: { tone: LegendItem['tone']; overlay?: boolean }) {
  if (tone === 'band') {
    return (
      <svg width="22" height="10" aria-hidden="true" className="shrink-0">
        <rect x="0" y="1" width="22" height="8" fill={CHART_COLOURS.band} fillOpacity={0.3} stroke={CHART_COLOURS.bandEdge} strokeWidth={0.75} />
      </svg>
    );
  }
  const s = TONE_STYLE[tone];
  return (
    <svg width="22" height="10" aria-hidden="true" className="shrink-0">
      <line
        x1="1"
        x2="21"
        y1="5"
        y2="5"
        stroke={s.stroke}
        strokeWidth={overlay ? OVERLAY_STYLE.width : s.width}
        strokeDasharray={overlay ? OVERLAY_STYLE.dash : s.dash}
        strokeOpacity={overlay ? OVERLAY_STYLE.opacity : 1}
        strokeLinecap={overlay ? 'round' : 'butt'}
      />
    </svg>
  );
}

export function ChartLegend({ items }: { items: LegendItem[] }) {
  return (
    <ul className="flex flex-wrap items-center gap-x-3 gap-y-0.5 text-sm text-ink-muted">
      {items.map((it) => (
        <li key={`${it.tone}-${it.label}`} className="inline-flex items-center gap-1.5">
          <Swatch tone={it.tone} overlay={it.overlay} />
          <span>{it.label}</span>
        </li>
      ))}
    </ul>
  );
}
