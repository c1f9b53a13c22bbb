import type { Config } from 'tailwindcss';

/** Lifeplate's design tokens. Colour is never the only signal: every status also carries a word and an icon. */
export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        iron: { DEFAULT: '#23272B', soft: '#3A4046', muted: '#5B636B' },
        plate: { DEFAULT: '#F6F3EE', deep: '#ECE6DC', line: '#D9D1C3' },
        brass: { DEFAULT: '#A9844F', dark: '#7E6139', light: '#E9DcC4' },
        ok: { DEFAULT: '#2E7D6B', soft: '#DCEFE9' },
        soon: { DEFAULT: '#B7791F', soft: '#F7EBD6' },
        due: { DEFAULT: '#B23A2E', soft: '#F6DEDA' },
        unsafe: { DEFAULT: '#C8102E', soft: '#FFFFFF' },
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
