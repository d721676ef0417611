import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import { BAND_FILL_OPACITY, CHART_COLOURS, OVERLAY_STYLE, PHASE_FILLS } from '@/components/charts/lib/palette';
import { palette } from '@/tailwind.config';

// Contrast of the palette tokens against the backgrounds they are really drawn on.
//
// Source: WCAG 2.1 (W3C Recommendation, 2018), definitions "relative luminance" and "contrast ratio":
//   L = 0.2126 R + 0.7152 G + 0.0722 B, with each sRGB channel C = c/255 linearised as
//   C <= 0.03928 ? C/12.92 : ((C + 0.055)/1.055)^2.4, and contrast ratio = (L1 + 0.05) / (L2 + 0.05), L1 the lighter.
// Thresholds: SC 1.4.3 Contrast (Minimum), level AA: 4.5:1 for text (3:1 only for large text, which these labels
// are not); SC 1.4.11 Non-text Contrast, level AA: 3:1 for graphics needed to understand the content (trace lines,
// band edges, markers) and for the visible focus indicator. Inactive (disabled) controls are exempt from both.
// The ratio function is checked against the definition's own end points (black on white is 21:1, any colour on
// itself 1:1) and against axe-core's implementation (the same package the browser tests run).
//
// Tints: Tailwind 4 writes `bg-foot-lead/10` as color-mix(in oklab, <colour> 10%, transparent), i.e. the colour at
// alpha 0.1, which the browser composites over what is behind it channel by channel in sRGB; `over` does the same.

type Hex = `#${string}`;

function channel(c: number): number {
  const s = c / 255;
  return s <= 0.03928 ? s / 12.92 : ((s + 0.055) / 1.055) ** 2.4;
}
function rgb(hex: string): [number, number, number] {
  if (!/^#[0-9a-f]{6}$/i.test(hex)) throw new RangeError(`not a #rrggbb colour: ${hex}`);
  return [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16)) as [number, number, number];
}
function luminance(hex: string): number {
  const [r, g, b] = rgb(hex).map(channel);
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}
function contrastRatio(a: string, b: string): number {
  const [hi, lo] = [luminance(a), luminance(b)].sort((x, y) => y - x);
  return (hi + 0.05) / (lo + 0.05);
}
/** `fg` at `alpha` composited over the opaque `bg` (source-over, in sRGB), as #rrggbb. */
function over(fg: string, alpha: number, bg: string): Hex {
  const f = rgb(fg);
  const b = rgb(bg);
  return `#${f.map((c, i) => Math.round(c * alpha + b[i] * (1 - alpha)).toString(16).padStart(2, '0')).join('')}`;
}

const TEXT = 4.5; // SC 1.4.3
const GRAPHIC = 3; // SC 1.4.11

const { surface, ink, foot, band, accent, ok, notice, danger } = palette;
const pageBackgrounds = { surface: surface.DEFAULT, sunken: surface.sunken } as const;

// [what, foreground, background, where it is used]
const textPairs: [string, string, string][] = [
  ...Object.entries(pageBackgrounds).flatMap(([name, bg]): [string, string, string][] => [
    [`ink on ${name}`, ink.DEFAULT, bg],
    [`ink-muted on ${name}`, ink.muted, bg],
    [`ink-faint on ${name} (table heads, keyboard help, file lines)`, ink.faint, bg],
    [`accent links on ${name}`, accent.DEFAULT, bg],
    [`lead-ink on ${name}`, foot['lead-ink'], bg],
    [`trail-ink on ${name}`, foot['trail-ink'], bg],
    // Badge tone lead/trail: text on the foot colour's 10 % tint (components/ui/badge.tsx)
    [`lead-ink on the lead 10 % tint over ${name}`, foot['lead-ink'], over(foot.lead, 0.1, bg)],
    [`trail-ink on the trail 10 % tint over ${name}`, foot['trail-ink'], over(foot.trail, 0.1, bg)],
    [`danger on ${name}`, danger.DEFAULT, bg],
  ]),
  ['ink-muted on the phase shading (phase names in the charts)', ink.muted, surface.phase],
  ['ink-faint on the phase shading', ink.faint, surface.phase],
  ['ink on band-soft (notes)', ink.DEFAULT, band.soft],
  ['ink-muted on band-soft', ink.muted, band.soft],
  ['white on accent (primary button)', '#FFFFFF', accent.DEFAULT],
  ['white on accent-strong (primary button, hover)', '#FFFFFF', accent.strong],
  ['pass: ok on ok-soft', ok.DEFAULT, ok.soft],
  ['miss: notice on notice-soft (also the health caution)', notice.DEFAULT, notice.soft],
  ['danger on danger-soft (errors)', danger.DEFAULT, danger.soft],
  ['ink on the zoom button pressed (white on ink)', '#FFFFFF', ink.DEFAULT],
];

// Graphics drawn on the chart backgrounds: white plot, phase shading, the band's tinted area.
const chartBackgrounds = {
  white: surface.DEFAULT,
  'phase shading': PHASE_FILLS[0],
  'band area': over(CHART_COLOURS.band, BAND_FILL_OPACITY, surface.DEFAULT),
  'band area on phase shading': over(CHART_COLOURS.band, BAND_FILL_OPACITY, PHASE_FILLS[0]),
} as const;
const graphicPairs: [string, string, string][] = [
  ...Object.entries(chartBackgrounds).flatMap(([name, bg]): [string, string, string][] => [
    [`lead trace on ${name}`, CHART_COLOURS.lead, bg],
    [`trail trace on ${name}`, CHART_COLOURS.trail, bg],
    [`event marker (ink-muted) on ${name}`, CHART_COLOURS.inkMuted, bg],
  ]),
  [`band edge on white`, CHART_COLOURS.bandEdge, chartBackgrounds.white],
  [`band edge on the phase shading`, CHART_COLOURS.bandEdge, chartBackgrounds['phase shading']],
  [`band edge on the band area`, CHART_COLOURS.bandEdge, chartBackgrounds['band area']],
  [`band edge on the band area over the phase shading`, CHART_COLOURS.bandEdge, chartBackgrounds['band area on phase shading']],
  // the compared swing is drawn at OVERLAY_STYLE.opacity: its colour as seen is a composite
  [`overlaid lead trace on white`, over(CHART_COLOURS.lead, OVERLAY_STYLE.opacity, surface.DEFAULT), surface.DEFAULT],
  [`overlaid trail trace on white`, over(CHART_COLOURS.trail, OVERLAY_STYLE.opacity, surface.DEFAULT), surface.DEFAULT],
  [`overlaid lead trace on the phase shading`, over(CHART_COLOURS.lead, OVERLAY_STYLE.opacity, PHASE_FILLS[0]), PHASE_FILLS[0]],
  [`overlaid trail trace on the phase shading`, over(CHART_COLOURS.trail, OVERLAY_STYLE.opacity, PHASE_FILLS[0]), PHASE_FILLS[0]],
  // the focus ring (app/globals.css :focus-visible, 2px accent) on every page background
  ...Object.entries(pageBackgrounds).map(([name, bg]): [string, string, string] => [`focus ring on ${name}`, accent.DEFAULT, bg]),
];

describe('contrastRatio (WCAG 2.1 definition)', () => {
  it('gives the definition’s end points: 21:1 for black on white, 1:1 for a colour on itself', () => {
    expect(contrastRatio('#000000', '#FFFFFF')).toBeCloseTo(21, 10);
    expect(contrastRatio('#FFFFFF', '#000000')).toBeCloseTo(21, 10);
    expect(contrastRatio('#0072B2', '#0072B2')).toBe(1);
  });

  it('agrees with axe-core’s own implementation on every pair below', () => {
    const require = createRequire(import.meta.url);
    const axe = require('axe-core') as { commons: { color: { Color: new () => { parseString(s: string): void }; getContrast(bg: unknown, fg: unknown): number } } };
    const colour = (hex: string) => {
      const c = new axe.commons.color.Color();
      c.parseString(hex);
      return c;
    };
    for (const [, fg, bg] of [...textPairs, ...graphicPairs]) {
      expect(contrastRatio(fg, bg)).toBeCloseTo(axe.commons.color.getContrast(colour(bg), colour(fg)), 2);
    }
  });

  it('reproduces the measured failures the palette had: faint grey 3.1:1 on white, lead blue 4.16:1 on its tint over the sunken surface', () => {
    // the values axe-core reported in the browser before the tokens changed
    expect(contrastRatio('#8A93A1', '#FFFFFF')).toBeCloseTo(3.1, 1);
    expect(contrastRatio('#0072B2', over('#0072B2', 0.1, '#F4F5F7'))).toBeCloseTo(4.16, 2);
  });
});

describe('palette tokens against their real backgrounds', () => {
  it.each(textPairs)('text, at least 4.5:1 (SC 1.4.3): %s', (_what, fg, bg) => {
    expect(contrastRatio(fg, bg)).toBeGreaterThanOrEqual(TEXT);
  });

  it.each(graphicPairs)('graphics, at least 3:1 (SC 1.4.11): %s', (_what, fg, bg) => {
    expect(contrastRatio(fg, bg)).toBeGreaterThanOrEqual(GRAPHIC);
  });

  it('keeps the meaning: lead, trail and band are the published Okabe-Ito blue, vermillion and sky blue', () => {
    // Okabe & Ito (2008), "Color Universal Design": blue 0,114,178; vermillion 213,94,0; sky blue 86,180,233
    expect(rgb(foot.lead)).toEqual([0, 114, 178]);
    expect(rgb(foot.trail)).toEqual([213, 94, 0]);
    expect(rgb(band.DEFAULT)).toEqual([86, 180, 233]);
    expect(CHART_COLOURS.lead).toBe(foot.lead);
    expect(CHART_COLOURS.trail).toBe(foot.trail);
    expect(CHART_COLOURS.band).toBe(band.DEFAULT);
  });

  it('the darker text and edge shades keep their base hue (within 6°) and are darker than it', () => {
    const hue = (hex: string) => {
      const [r, g, b] = rgb(hex).map((c) => c / 255);
      const max = Math.max(r, g, b);
      const d = max - Math.min(r, g, b);
      const h = max === r ? ((g - b) / d) % 6 : max === g ? (b - r) / d + 2 : (r - g) / d + 4;
      return (h * 60 + 360) % 360;
    };
    for (const [shade, base] of [
      [foot['lead-ink'], foot.lead],
      [foot['trail-ink'], foot.trail],
      [band.edge, band.DEFAULT],
    ] as const) {
      expect(Math.abs(hue(shade) - hue(base))).toBeLessThan(6);
      expect(luminance(shade)).toBeLessThan(luminance(base));
    }
  });
});
