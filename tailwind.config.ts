import type { Config } from 'tailwindcss';

// Heelwood's own palette: paper and bark, leaf green for action, currant for emphasis,
// rust for danger. Contrast checked for text on paper in sunlight (AA or better).
export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        paper: { DEFAULT: '#f8f4eb', deep: '#efe7d6', edge: '#d9ccb3' },
        ink: { DEFAULT: '#26221d', soft: '#4f463c', faint: '#6d6254' },
        bark: { DEFAULT: '#6f543d', light: '#a58a6c' },
        leaf: { DEFAULT: '#2f6b34', dark: '#224f27', light: '#dcebd5' },
        currant: { DEFAULT: '#6a1f48', light: '#f1dde8' },
        rust: { DEFAULT: '#a63d1f', light: '#f6dfd5' },
        amber: { DEFAULT: '#8a5a00', light: '#f7e9c6' },
      },
      fontFamily: {
        sans: ['"Work Sans"', 'system-ui', 'sans-serif'],
      },
      borderRadius: {
        card: '0.75rem',
      },
      minHeight: {
        touch: '2.75rem',
      },
    },
  },
} satisfies Config;
