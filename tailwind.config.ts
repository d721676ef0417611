import type { Config } from 'tailwindcss';

// Stanceline design tokens.
// Foot and reference colours come from the Okabe-Ito palette (Okabe & Ito, "Color Universal Design",
// 2008), a published set chosen to stay distinguishable under the common forms of colour-vision deficiency.
// Lead foot = blue (#0072B2), trail foot = vermillion (#D55E00): the pair differs in both hue and lightness,
// so it survives protanopia, deuteranopia and greyscale printing. Reference band = sky blue (#56B4E9) at low
// opacity behind the traces. Ink and surfaces are neutral slate-like greys so the data colours carry meaning.
//
// Contrast (WCAG 2.1 SC 1.4.3 and 1.4.11; tests/charts/palette-contrast.test.ts checks every pair in use):
// - text needs 4.5:1 against the background it sits on. The Okabe-Ito blue and vermillion are kept for lines,
//   markers and fills; text in a foot colour uses the same hue darkened (`lead-ink`, `trail-ink`), because
//   vermillion on white is only 3.9:1 and blue on its own 10 % tint about 4.2-4.5:1.
// - lines and other graphics that carry meaning need 3:1: the sky-blue band itself is 2.3:1 on white, so its
//   edges and mean are drawn in `band.edge`, the same hue darkened; the fill stays sky blue.
// - `ink.faint` is the lightest text grey that still reads 4.5:1 on white, the sunken surface and the phase shading.
export const palette = {
  foot: {
    lead: '#0072B2',
    trail: '#D55E00',
    'lead-ink': '#005A8C',
    'trail-ink': '#A14700',
  },
  band: {
    DEFAULT: '#56B4E9',
    soft: '#E3F2FB',
    edge: '#2B83BA',
  },
  ink: {
    DEFAULT: '#1D2430',
    muted: '#566070',
    faint: '#646D7B',
  },
  surface: {
    DEFAULT: '#FFFFFF',
    sunken: '#F4F5F7',
    line: '#DDE1E6',
    // alternate phase shading behind the traces (components/charts/lib/palette.ts)
    phase: '#F1F3F5',
  },
  accent: {
    DEFAULT: '#0072B2',
    strong: '#005A8C',
  },
  // Okabe-Ito reddish purple for errors and yellow for notes: distinct from both foot colours.
  danger: { DEFAULT: '#A4477A', soft: '#F7E9F1' },
  notice: { DEFAULT: '#7A5B00', soft: '#FFF6D6', line: '#F0E442' },
  ok: { DEFAULT: '#00785A', soft: '#E0F3EC' },
} as const;

const config: Config = {
  content: ['./app/**/*.{ts,tsx}', './components/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: palette,
      fontFamily: {
        sans: ['var(--font-inter)', 'system-ui', 'sans-serif'],
      },
      maxWidth: {
        page: '72rem',
      },
    },
  },
};

export default config;
