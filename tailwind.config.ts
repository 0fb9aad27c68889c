import type { Config } from 'tailwindcss';

/**
 * Grisaille's own design tokens (DESIGN.md §6): paper and ink neutrals, an eleven-step grey ramp that is also
 * the zone scale (zone 0..X at CIE L* = 0, 10 … 100, so zone V is L* 50 ≈ 18 % grey), one accent for actions
 * and one warning colour for merges and clipping.
 */
export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        paper: { DEFAULT: '#f6f4ef', raised: '#fdfcf9', sunk: '#ebe8e0', line: '#d9d5ca' },
        ink: { DEFAULT: '#1b1a18', soft: '#4a4742', mute: '#77736b' },
        zone: {
          0: '#000000', 1: '#1b1b1b', 2: '#303030', 3: '#474747', 4: '#5e5e5e', 5: '#777777',
          6: '#919191', 7: '#ababab', 8: '#c6c6c6', 9: '#e2e2e2', 10: '#ffffff',
        },
        accent: { DEFAULT: '#1d5c7a', strong: '#144256', soft: '#d7e6ed' },
        warn: { DEFAULT: '#c2410c', soft: '#fbe3d6' },
      },
      fontFamily: {
        sans: ['Inter', 'system-ui', 'sans-serif'],
      },
    },
  },
} satisfies Config;
