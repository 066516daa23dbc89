/** Tailwind 4 runs as a PostCSS plugin; the design tokens come from tailwind.config.ts via @config. */
const config = {
  plugins: {
    '@tailwindcss/postcss': {},
  },
};

export default config;
