// Chart colours, taken from the tokens in tailwind.config.ts (Okabe-Ito for the feet and the band). SVG attributes
// take plain values, so the charts read them here; nothing else in the charts names a colour.
import { palette } from '@/tailwind.config';
import type { LineTone } from './types';

export const CHART_COLOURS = {
  lead: palette.foot.lead,
  trail: palette.foot.trail,
  band: palette.band.DEFAULT,
  bandSoft: palette.band.soft,
  bandEdge: palette.band.edge,
  ink: palette.ink.DEFAULT,
  inkMuted: palette.ink.muted,
  inkFaint: palette.ink.faint,
  surface: palette.surface.DEFAULT,
  sunken: palette.surface.sunken,
  line: palette.surface.line,
  accent: palette.accent.DEFAULT,
} as const;

/** Colour, dash pattern (SVG stroke-dasharray) and width for each tone. Lead solid, trail dashed. */
export const TONE_STYLE: Record<LineTone, { stroke: string; dash: string | undefined; width: number }> = {
  lead: { stroke: CHART_COLOURS.lead, dash: undefined, width: 2 },
  trail: { stroke: CHART_COLOURS.trail, dash: '6 4', width: 2 },
  neutral: { stroke: CHART_COLOURS.ink, dash: undefined, width: 1.75 },
};

/**
 * The compared swing: dotted and thinner so the swing under study stays in front. Not faded: at 75 % opacity the
 * vermillion fell below the 3:1 that WCAG 2.1 SC 1.4.11 asks of a line that carries meaning.
 */
// round dots 3 px wide every 5 px against the 2 px solid (or dashed) line: told apart by width and dash, not by colour alone
export const OVERLAY_STYLE = { dash: '0.1 5', width: 3, opacity: 1 } as const;

/** Opacity of the reference band's sky-blue area; its edges are drawn in CHART_COLOURS.bandEdge. */
export const BAND_FILL_OPACITY = 0.2;

/** Alternating neutral shades for the phases (their names are written in the chart too). */
export const PHASE_FILLS = [palette.surface.phase, palette.surface.DEFAULT] as const;
