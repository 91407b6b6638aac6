import type { FailureMode } from './engine/types';

// Isobath's design tokens, the one place for its colours, fonts and radii. tailwind.config.ts
// gives them to the client's classes; the charts and the design-record PDF read them from here.
// Colours are named for the sea floor and the chart room: ink for text, chart for surfaces,
// sounding (teal-blue) for actions, brass for emphasis, and one colour per failure mode used
// consistently in tables, charts and the design record.

/** One colour per failure mode. */
export const MODE_COLOURS: Record<FailureMode, string> = {
  tension: '#b5472f',
  compression: '#2c5b87',
  shear: '#6f7f25',
  buckling: '#74468d',
};

export const colors = {
  ink: { DEFAULT: '#10242f', soft: '#3b5360', faint: '#6b7f89' },
  chart: { DEFAULT: '#f4f2ec', raised: '#fbfaf7', line: '#d9d4c7', deep: '#e8e4d9' },
  sounding: { DEFAULT: '#1b5e6e', dark: '#123f4a', light: '#d6e8ea' },
  brass: { DEFAULT: '#9c6a1c', light: '#f3e6cd' },
  trench: '#0c1c24',
  mode: MODE_COLOURS,
  verdict: { pass: '#2e7048', watch: '#a36a00', fail: '#a8261c' },
};

export const fontFamily = {
  sans: ['Lato', 'system-ui', 'sans-serif'],
  mono: ['ui-monospace', 'SFMono-Regular', 'Menlo', 'monospace'],
};

export const borderRadius = { plate: '3px' };

export const boxShadow = { plate: '0 1px 0 rgba(16,36,47,0.08), 0 0 0 1px rgba(16,36,47,0.06)' };
