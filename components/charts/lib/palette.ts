// Chart colours, from the tokens in tailwind.config.ts (Okabe-Ito for the feet and the band). SVG attributes take
// plain values, so they are repeated here once; nothing else in the charts names a colour.
import type { LineTone } from './types';

export const CHART_COLOURS = {
  lead: '#0072B2',
  trail: '#D55E00',
  band: '#56B4E9',
  bandSoft: '#E3F2FB',
  ink: '#1D2430',
  inkMuted: '#566070',
  inkFaint: '#8A93A1',
  surface: '#FFFFFF',
  sunken: '#F4F5F7',
  line: '#DDE1E6',
  accent: '#0072B2',
} as const;

/** Colour, dash pattern (SVG stroke-dasharray) and width for each tone. Lead solid, trail dashed. */
export const TONE_STYLE: Record<LineTone, { stroke: string; dash: string | undefined; width: number }> = {
  lead: { stroke: CHART_COLOURS.lead, dash: undefined, width: 2 },
  trail: { stroke: CHART_COLOURS.trail, dash: '6 4', width: 2 },
  neutral: { stroke: CHART_COLOURS.ink, dash: undefined, width: 1.75 },
};

/** The compared swing: dotted, thinner and faded so the swing under study stays in front. */
export const OVERLAY_STYLE = { dash: '1.5 3.5', width: 1.5, opacity: 0.75 } as const;

/** Alternating neutral shades for the phases (their names are written in the chart too). */
export const PHASE_FILLS = ['#EEF0F3', '#FFFFFF'] as const;
