import type { Config } from 'tailwindcss';
import { borderRadius, boxShadow, colors, fontFamily } from './shared/design-tokens';

// The theme comes from Isobath's design tokens (shared/design-tokens.ts), which the charts and
// the design-record PDF read too.
export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: { colors, fontFamily, borderRadius, boxShadow },
  },
} satisfies Config;
