import type { Config } from 'tailwindcss';

// Brinewright's own palette: brine greens, copper for action, beet for danger,
// honey for caution, on a warm paper ground.
const config: Config = {
  content: ['./app/**/*.{ts,tsx,mdx}', './components/**/*.{ts,tsx}', './content/**/*.mdx', './lib/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        brine: {
          50: '#eef6f3',
          100: '#d5e9e1',
          200: '#abd3c4',
          300: '#7bb8a2',
          400: '#4f9a80',
          500: '#357e66',
          600: '#276552',
          700: '#1f5043',
          800: '#1a4037',
          900: '#13302a',
        },
        copper: {
          50: '#fbf3ec',
          100: '#f5e1cf',
          300: '#e0a673',
          500: '#b86a2e',
          600: '#9a5523',
          700: '#7b431d',
        },
        beet: { 50: '#fbeff2', 100: '#f4d3dc', 500: '#a3294f', 600: '#8a1f41', 700: '#6e1834' },
        honey: { 50: '#fdf7e6', 100: '#f9eac0', 500: '#b98a12', 700: '#7a5a0a' },
        paper: { DEFAULT: '#fbf8f1', deep: '#f2ece0' },
        ink: { DEFAULT: '#1d2522', soft: '#46524d', faint: '#6b7772' },
      },
      fontFamily: {
        display: ['Merriweather', 'Georgia', 'serif'],
        sans: ['system-ui', '-apple-system', 'Segoe UI', 'Roboto', 'Helvetica Neue', 'Arial', 'sans-serif'],
      },
      borderRadius: {
        jar: '0.9rem',
      },
      boxShadow: {
        shelf: '0 1px 0 rgba(29,37,34,0.06), 0 4px 14px -6px rgba(29,37,34,0.18)',
      },
    },
  },
};

export default config;
