import type { Config } from 'tailwindcss';

/**
 * Loadbearing's design tokens. The palette replaces Tailwind's default one on purpose: every
 * colour on screen comes from this file, so the look stays one product's look.
 *
 * - chalk: warm off-white to near-black neutrals (paper, lines, ink)
 * - granite: the deep green-slate primary (actions, links, the brand)
 * - rope: the orange accent, used sparingly (highlights, focus, the mark); rope-700 and darker
 *   are the only shades dark enough for text on chalk
 * - success / warning / danger: states, each with a tint for backgrounds and a shade for text
 */
const chalk = {
  50: '#fbf9f5',
  100: '#f4f0e8',
  200: '#e7e1d5',
  300: '#d5ccbc',
  400: '#b0a695',
  500: '#877e6f',
  600: '#675f53',
  700: '#4c463d',
  800: '#33302a',
  900: '#211f1b',
  950: '#151411',
};

const granite = {
  50: '#eef4f1',
  100: '#d7e5df',
  200: '#afcbc0',
  300: '#82ab9d',
  400: '#588a7b',
  500: '#3c6e60',
  600: '#2f594e',
  700: '#274a41',
  800: '#203d36',
  900: '#1a312b',
  950: '#0f1f1b',
};

const rope = {
  50: '#fff6ed',
  100: '#ffe8d2',
  200: '#fdcb9f',
  300: '#f9a765',
  400: '#f38536',
  500: '#e16a17',
  600: '#c2540e',
  700: '#9c420f',
  800: '#7d3513',
  900: '#662d13',
};

const config: Config = {
  content: ['./app/**/*.{ts,tsx}', './components/**/*.{ts,tsx}'],
  theme: {
    colors: {
      transparent: 'transparent',
      current: 'currentColor',
      white: '#ffffff',
      black: '#000000',
      chalk,
      granite,
      rope,
      success: { 50: '#eef7ee', 100: '#d5ecd6', 500: '#3f8a47', 600: '#2f7237', 700: '#265c2d', 800: '#1f4a25' },
      warning: { 50: '#fdf7e7', 100: '#f9ebc2', 500: '#c79216', 600: '#a0740f', 700: '#7d5a10', 800: '#634812' },
      danger: { 50: '#fcefed', 100: '#f8d7d2', 500: '#cf4a3b', 600: '#b23a2d', 700: '#922f25', 800: '#762821' },
      // Semantic aliases, so components say what a colour is for rather than which shade it is.
      paper: { DEFAULT: chalk[50], raised: '#ffffff', sunken: chalk[100] },
      ink: { DEFAULT: chalk[900], muted: chalk[600], faint: chalk[500], inverse: chalk[50] },
      line: { DEFAULT: chalk[200], strong: chalk[300] },
      brand: { DEFAULT: granite[700], hover: granite[800], soft: granite[50] },
      accent: { DEFAULT: rope[500], text: rope[700], soft: rope[50] },
    },
    extend: {
      fontFamily: {
        sans: ['var(--font-inter)', 'ui-sans-serif', 'system-ui', 'sans-serif'],
        display: ['var(--font-space-grotesk)', 'var(--font-inter)', 'ui-sans-serif', 'system-ui', 'sans-serif'],
        mono: ['ui-monospace', 'SFMono-Regular', 'Menlo', 'Consolas', 'monospace'],
      },
      // A 1.2 step from a 16px body: readable on a phone at the gym, compact enough for tables.
      fontSize: {
        xs: ['0.75rem', { lineHeight: '1.1rem' }],
        sm: ['0.875rem', { lineHeight: '1.35rem' }],
        base: ['1rem', { lineHeight: '1.6rem' }],
        lg: ['1.125rem', { lineHeight: '1.7rem' }],
        xl: ['1.35rem', { lineHeight: '1.85rem', letterSpacing: '-0.01em' }],
        '2xl': ['1.62rem', { lineHeight: '2.1rem', letterSpacing: '-0.015em' }],
        '3xl': ['1.94rem', { lineHeight: '2.35rem', letterSpacing: '-0.02em' }],
        '4xl': ['2.33rem', { lineHeight: '2.7rem', letterSpacing: '-0.025em' }],
        '5xl': ['2.8rem', { lineHeight: '3.05rem', letterSpacing: '-0.03em' }],
      },
      spacing: {
        gutter: '1.25rem',
        section: '4.5rem',
      },
      maxWidth: {
        shell: '72rem',
        form: '27rem',
        measure: '40rem',
      },
      borderRadius: {
        sm: '0.25rem',
        DEFAULT: '0.375rem',
        md: '0.5rem',
        lg: '0.75rem',
        xl: '1rem',
      },
      boxShadow: {
        card: '0 1px 0 rgb(33 31 27 / 0.04), 0 1px 3px rgb(33 31 27 / 0.08)',
        lift: '0 2px 4px rgb(33 31 27 / 0.06), 0 10px 24px -8px rgb(33 31 27 / 0.18)',
      },
    },
  },
};

export default config;
