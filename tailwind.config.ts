import type { Config } from 'tailwindcss'

/**
 * Wingfold's own theme: a deep-ink text colour on warm paper, a sea-glass accent for actions,
 * amber for cautions, and a small type scale in Space Grotesk (bundled from @fontsource).
 */
export default {
  content: ['./app/**/*.{vue,ts}'],
  theme: {
    extend: {
      colors: {
        ink: { 50: '#f3f5f7', 100: '#e3e8ed', 200: '#c5cfd9', 300: '#9aabbb', 400: '#6d8296', 500: '#4f6477', 600: '#3c4e5f', 700: '#2e3c4a', 800: '#1f2934', 900: '#131a22' },
        paper: { DEFAULT: '#fbfaf6', deep: '#f2efe6' },
        glass: { 50: '#eefaf7', 100: '#d3f1ea', 200: '#a6e2d5', 300: '#6fcbb9', 400: '#3daf9b', 500: '#22927f', 600: '#187566', 700: '#155e53', 800: '#134b43', 900: '#103d37' },
        amber: { 50: '#fff8eb', 100: '#feecc6', 200: '#fdd688', 300: '#fbb94a', 400: '#f59e1f', 500: '#d97c0b', 600: '#b05b07', 700: '#8c440b', 800: '#733810', 900: '#602f11' },
        rust: { 50: '#fdf1ef', 100: '#fbdcd7', 500: '#c2412d', 600: '#a23322', 700: '#84291c' },
      },
      fontFamily: {
        sans: ['"Space Grotesk"', 'ui-sans-serif', 'system-ui', 'sans-serif'],
        mono: ['ui-monospace', 'SFMono-Regular', 'Menlo', 'monospace'],
      },
      fontSize: {
        'xs': ['0.75rem', { lineHeight: '1.1rem' }],
        'sm': ['0.875rem', { lineHeight: '1.3rem' }],
        'base': ['1rem', { lineHeight: '1.55rem' }],
        'lg': ['1.2rem', { lineHeight: '1.7rem' }],
        'xl': ['1.44rem', { lineHeight: '1.9rem', letterSpacing: '-0.01em' }],
        '2xl': ['1.73rem', { lineHeight: '2.2rem', letterSpacing: '-0.015em' }],
        '3xl': ['2.07rem', { lineHeight: '2.5rem', letterSpacing: '-0.02em' }],
      },
      spacing: { 18: '4.5rem', 88: '22rem' },
      borderRadius: { card: '0.6rem' },
      boxShadow: { card: '0 1px 2px rgba(19, 26, 34, 0.06), 0 4px 14px rgba(19, 26, 34, 0.05)' },
      // wide: pages whose plots take the width of the screen (runs, maps, compare, workbench)
      maxWidth: { page: '72rem', wide: '120rem' },
    },
  },
  plugins: [],
} satisfies Config
