import type { Config } from 'tailwindcss';

/**
 * Lifeplate's design tokens. Each colour reads a CSS variable (set for the dark "basement" theme in src/index.css)
 * and falls back to its light value here. Colour is never the only signal: every status also carries a word and an icon.
 */
const token = (name: string, light: string) => `var(--lp-${name}, ${light})`;

export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        iron: { DEFAULT: token('iron', '#23272B'), soft: token('iron-soft', '#3A4046'), muted: token('iron-muted', '#5B636B') },
        plate: { DEFAULT: token('plate', '#F6F3EE'), deep: token('plate-deep', '#ECE6DC'), line: token('plate-line', '#D9D1C3') },
        surface: token('surface', '#FFFFFF'),
        brass: { DEFAULT: '#A9844F', dark: token('brass-dark', '#7E6139'), light: token('brass-light', '#E9DCC4') },
        ok: { DEFAULT: token('ok', '#22614F'), soft: token('ok-soft', '#DCEFE9') },
        soon: { DEFAULT: token('soon', '#8A5A12'), soft: token('soon-soft', '#F7EBD6') },
        due: { DEFAULT: token('due', '#B23A2E'), soft: token('due-soft', '#F6DEDA') },
        unsafe: { DEFAULT: token('unsafe', '#C8102E'), soft: token('unsafe-soft', '#FFFFFF') },
        // The header stays dark in both themes.
        header: { DEFAULT: '#23272B', text: '#F6F3EE', soft: '#3A4046' },
      },
      fontFamily: {
        sans: ['"Source Sans 3"', 'ui-sans-serif', 'system-ui', 'sans-serif'],
      },
      fontSize: {
        // A short scale, large enough to read at arm's length in a basement.
        xs: ['0.8125rem', { lineHeight: '1.15rem' }],
        sm: ['0.9375rem', { lineHeight: '1.35rem' }],
        base: ['1.0625rem', { lineHeight: '1.55rem' }],
        lg: ['1.25rem', { lineHeight: '1.7rem' }],
        xl: ['1.5rem', { lineHeight: '1.9rem' }],
        '2xl': ['1.875rem', { lineHeight: '2.2rem' }],
      },
      spacing: { tap: '2.75rem' },
      minHeight: { tap: '2.75rem' },
      minWidth: { tap: '2.75rem' },
      borderRadius: { plate: '0.625rem' },
    },
  },
} satisfies Config;
