import type { Config } from 'tailwindcss';
import plugin from 'tailwindcss/plugin';

/**
 * Scrubline design tokens.
 *
 * Colours point at CSS variables defined in src/styles/index.css, which holds the light values
 * (default) and the dark values (when the system asks for them). Pairs checked for WCAG contrast
 * in both themes: ink on canvas/surface ≥ 14:1 (AAA, used for times); ink-muted ≥ 6.3:1;
 * text on the accent ≥ 6.3:1; link, warning and success text ≥ 5.7:1; control borders ≥ 4.1:1.
 */
const v = (name: string) => `var(--sl-${name})`;

export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    colors: {
      transparent: 'transparent',
      current: 'currentColor',
      inherit: 'inherit',
      white: '#ffffff',
      black: '#000000',
      /** Page background. */
      canvas: v('canvas'),
      /** Cards, bars, inputs. */
      surface: { DEFAULT: v('surface'), raised: v('surface-raised') },
      ink: { DEFAULT: v('ink'), muted: v('ink-muted') },
      line: { DEFAULT: v('line'), strong: v('line-strong') },
      /** The one action colour: a deep teal (light theme) / bright teal (dark theme). */
      accent: { DEFAULT: v('accent'), hover: v('accent-hover'), ink: v('accent-ink'), soft: v('accent-soft') },
      link: v('link'),
      focus: v('focus'),
      /** Cautions and errors. */
      warning: { DEFAULT: v('warning'), surface: v('warning-surface'), line: v('warning-line') },
      /** Quiet confirmation. */
      success: { DEFAULT: v('success'), surface: v('success-surface') },
    },
    fontFamily: {
      sans: ['"Nunito Sans"', 'system-ui', '-apple-system', '"Segoe UI"', 'Roboto', 'sans-serif'],
    },
    fontSize: {
      xs: ['0.8125rem', { lineHeight: '1.125rem' }],
      sm: ['0.875rem', { lineHeight: '1.25rem' }],
      base: ['1rem', { lineHeight: '1.5rem' }],
      lg: ['1.125rem', { lineHeight: '1.75rem' }],
      xl: ['1.25rem', { lineHeight: '1.75rem' }],
      '2xl': ['1.5rem', { lineHeight: '2rem' }],
      '3xl': ['1.875rem', { lineHeight: '2.375rem' }],
      /** Times and key measurements: never below 28 px. */
      time: ['1.75rem', { lineHeight: '2.125rem', fontWeight: '700' }],
      'time-lg': ['2.5rem', { lineHeight: '2.875rem', fontWeight: '700' }],
      'time-xl': ['3.5rem', { lineHeight: '3.75rem', fontWeight: '800' }],
    },
    fontWeight: {
      normal: '400',
      semibold: '600',
      bold: '700',
      extrabold: '800',
    },
    borderRadius: {
      none: '0',
      sm: '0.25rem',
      DEFAULT: '0.5rem',
      md: '0.5rem',
      lg: '0.75rem',
      xl: '1rem',
      full: '9999px',
    },
    extend: {
      spacing: {
        /** Smallest touch target (44 px). */
        tap: '2.75rem',
        /** Comfortable gloved touch target (56 px). */
        'tap-lg': '3.5rem',
      },
      maxWidth: {
        page: '60rem',
        form: '26rem',
      },
    },
  },
  plugins: [
    plugin(({ addUtilities }) => {
      addUtilities({
        /** Every time and measurement: digits of equal width that line up in columns. */
        '.tabular-figures': { 'font-variant-numeric': 'tabular-nums lining-nums' },
      });
    }),
  ],
} satisfies Config;
