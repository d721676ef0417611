// Tailwind 4 runs as a PostCSS plugin; the design tokens live in tailwind.config.ts (loaded by @config in globals.css).
const config = {
  plugins: { '@tailwindcss/postcss': {} },
};

export default config;
