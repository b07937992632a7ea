import type { Config } from 'tailwindcss';

// Ampwright's palette: warm greys for surfaces, one deep teal for actions, copper for highlights.
// Status colours are never used alone: every status also carries a shape and a word.
const config: Config = {
  content: ['./app/**/*.{ts,tsx}', './components/**/*.{ts,tsx}', './lib/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        surface: { DEFAULT: '#ffffff', muted: '#f6f4f1', sunken: '#eeeae5', line: '#ddd7cf' },
        ink: { DEFAULT: '#1f2326', muted: '#565c61', faint: '#80868b' },
        action: { DEFAULT: '#0f5e63', hover: '#0b4a4e', soft: '#e3f0f0', ring: '#3d8f94' },
        copper: { DEFAULT: '#b8642e', soft: '#f7e9df', deep: '#8a4519' },
        ok: { DEFAULT: '#1d6b3a', soft: '#e4f2e8' },
        near: { DEFAULT: '#8a5a00', soft: '#fbf0d6' },
        out: { DEFAULT: '#a3231b', soft: '#fbe5e2' },
      },
      fontFamily: {
        sans: ['var(--font-sans)', 'system-ui', 'sans-serif'],
        mono: ['var(--font-mono)', 'ui-monospace', 'monospace'],
      },
      minHeight: { target: '3rem' },
      minWidth: { target: '3rem' },
    },
  },
};

export default config;
