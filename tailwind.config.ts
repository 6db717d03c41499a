import type { Config } from 'tailwindcss';
import plugin from 'tailwindcss/plugin';

const monoStack = ['"IBM Plex Mono"', 'ui-monospace', 'monospace'];

export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        graphite: {
          50: '#f1f2f3',
          100: '#e2e4e6',
          200: '#c3c8cc',
          300: '#9aa1a7',
          400: '#737b82',
          500: '#555d64',
          600: '#3d444a',
          700: '#2d3338',
          800: '#23282c',
          900: '#1c2023',
          950: '#16191c',
        },
        paper: {
          50: '#fbfaf7',
          100: '#f6f4ef',
          200: '#ece8df',
          300: '#ddd7ca',
        },
        copper: {
          50: '#fbf3ec',
          100: '#f4e1cf',
          200: '#e8c09d',
          300: '#d99c6a',
          400: '#c9844c',
          500: '#b8733a',
          600: '#9c5e2e',
          700: '#7d4a25',
          800: '#5e381d',
          900: '#402615',
        },
        pass: { DEFAULT: '#2f7d4f', soft: '#e2f0e7', ink: '#1f5636' },
        fail: { DEFAULT: '#c42b2f', soft: '#fbe3e3', ink: '#8c1c20' },
        hold: { DEFAULT: '#d29a12', soft: '#fcf1d2', ink: '#6b4e00' },
      },
      fontFamily: {
        sans: ['"IBM Plex Sans"', 'ui-sans-serif', 'system-ui', 'sans-serif'],
        mono: monoStack,
      },
    },
  },
  plugins: [
    // Serials, measured values and counts: mono with tabular figures so columns line up.
    plugin(({ addUtilities }) => {
      addUtilities({
        '.figures': {
          'font-family': monoStack.join(', '),
          'font-variant-numeric': 'tabular-nums slashed-zero',
        },
      });
    }),
  ],
} satisfies Config;
