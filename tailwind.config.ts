import type { Config } from 'tailwindcss';

/**
 * Kcatalog's visual identity. Every colour in the product is one of these tokens; components never
 * write a colour value inline. Neutral "paper"/"ink" base, one deep blue-green brand colour ("lagoon")
 * and one warm accent ("ember") for calls to action.
 */
export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        paper: {
          50: '#f8f7f3',
          100: '#f1efe8',
          200: '#e4e1d7',
          300: '#d0ccbf',
          400: '#aaa598',
        },
        ink: {
          400: '#7c837f',
          500: '#5f6763',
          600: '#4a524e',
          700: '#363d3a',
          900: '#1b201e',
        },
        lagoon: {
          50: '#ebf5f3',
          100: '#cfe7e2',
          200: '#a3d0c8',
          300: '#7fb8af',
          500: '#23776e',
          600: '#1a645c',
          700: '#13524b',
          800: '#0e4a45',
          900: '#0a3431',
        },
        ember: {
          50: '#fdf3ea',
          100: '#f9e0c9',
          400: '#e0843a',
          500: '#c96a1f',
          600: '#a85616',
          700: '#854311',
        },
        // Catalytic roles on the sequence map: the Okabe–Ito colour-blind-safe palette (Okabe & Ito 2008,
        // "Color Universal Design"), always shown with a legend and a role letter.
        role: {
          nucleophile: '#D55E00',
          'general-acid': '#CC79A7',
          'general-base': '#0072B2',
          'acid-base': '#E69F00',
          'metal-ligand': '#009E73',
          'oxyanion-hole': '#56B4E9',
          'substrate-binding': '#F0E442',
          electrostatic: '#222222',
          other: '#8c8c8c',
        },
        signal: {
          danger: '#a8261b',
          'danger-soft': '#fbe9e7',
          caution: '#7a5300',
          'caution-soft': '#fbf1d9',
          fine: '#1d6337',
          'fine-soft': '#e3f2e8',
        },
      },
      fontFamily: {
        sans: ['"Public Sans Variable"', 'system-ui', 'sans-serif'],
        mono: ['"IBM Plex Mono"', 'ui-monospace', 'monospace'],
      },
      boxShadow: {
        card: '0 1px 2px rgb(27 32 30 / 0.06), 0 1px 1px rgb(27 32 30 / 0.04)',
      },
    },
  },
} satisfies Config;
