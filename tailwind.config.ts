import type { Config } from 'tailwindcss';

/**
 * Etchwell's own palette: warm graphite for text and chrome, an ember orange for actions (the
 * colour of a burn mark), birch paper for backgrounds, moss and rust for good and bad news.
 * A studio's storefront replaces the accent with its own colour through `--color-accent`.
 */
export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        graphite: {
          50: '#f6f5f4',
          100: '#e9e6e3',
          200: '#d3cdc8',
          300: '#b3aaa2',
          400: '#8d8279',
          500: '#6f655d',
          600: '#5a514a',
          700: '#48413c',
          800: '#332e2b',
          900: '#24211f',
          950: '#161413',
        },
        ember: {
          50: '#fdf4ee',
          100: '#fae3d3',
          200: '#f4c3a3',
          300: '#ec9d6e',
          400: '#e0743f',
          500: '#c85a26',
          600: '#a9461c',
          700: '#86371a',
          800: '#6b2e19',
          900: '#582817',
        },
        birch: { 50: '#fbf8f3', 100: '#f4eee4', 200: '#e8dfcf' },
        moss: { 100: '#e3efdc', 600: '#4c7a3a', 800: '#2f4c24' },
        rust: { 100: '#f8dcd7', 600: '#b3362a', 800: '#7c231b' },
        accent: 'var(--color-accent)',
      },
      fontFamily: {
        sans: ['Nunito', 'ui-sans-serif', 'system-ui', 'sans-serif'],
      },
      borderRadius: { card: '0.9rem' },
    },
  },
} satisfies Config;
