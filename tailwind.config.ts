import type { Config } from 'tailwindcss';

// Stanceline design tokens.
// Foot and reference colours come from the Okabe-Ito palette (Okabe & Ito, "Color Universal Design",
// 2008), a published set chosen to stay distinguishable under the common forms of colour-vision deficiency.
// Lead foot = blue (#0072B2), trail foot = vermillion (#D55E00): the pair differs in both hue and lightness,
// so it survives protanopia, deuteranopia and greyscale printing. Reference band = sky blue (#56B4E9) at low
// opacity behind the traces. Ink and surfaces are neutral slate-like greys so the data colours carry meaning.
const config: Config = {
  content: ['./app/**/*.{ts,tsx}', './components/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        foot: {
          lead: '#0072B2',
          trail: '#D55E00',
        },
        band: {
          DEFAULT: '#56B4E9',
          soft: '#E3F2FB',
        },
        ink: {
          DEFAULT: '#1D2430',
          muted: '#566070',
          faint: '#8A93A1',
        },
        surface: {
          DEFAULT: '#FFFFFF',
          sunken: '#F4F5F7',
          line: '#DDE1E6',
        },
        accent: {
          DEFAULT: '#0072B2',
          strong: '#005A8C',
        },
        // Okabe-Ito reddish purple for errors and yellow for notes: distinct from both foot colours.
        danger: { DEFAULT: '#A4477A', soft: '#F7E9F1' },
        notice: { DEFAULT: '#7A5B00', soft: '#FFF6D6', line: '#F0E442' },
        ok: { DEFAULT: '#00785A', soft: '#E0F3EC' },
      },
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
