import type { Config } from 'tailwindcss'

// A calm palette of our own: moss and bark greens, a warm clay accent, and a goldenrod highlight.
export default {
  content: [
    './app/**/*.{vue,ts,js}',
    './shared/**/*.ts',
  ],
  theme: {
    extend: {
      fontFamily: {
        sans: ['Nunito', 'ui-sans-serif', 'system-ui', 'sans-serif'],
      },
      colors: {
        moss: {
          50: '#f2f7f4', 100: '#e0ece5', 200: '#c2d9cb', 300: '#98bfa8', 400: '#6a9e80',
          500: '#4a8163', 600: '#38684f', 700: '#2f5d50', 800: '#264a3f', 900: '#1f3d34',
        },
        clay: {
          50: '#fbf5f1', 100: '#f5e6dc', 200: '#eaccb8', 300: '#dcaa8b', 400: '#cc845d',
          500: '#bf6a41', 600: '#a85536', 700: '#8b442f', 800: '#71392b', 900: '#5d3126',
        },
        goldenrod: { 100: '#fbf1d0', 300: '#f1d27a', 500: '#d9a520', 700: '#9c7412' },
        bark: { 50: '#f7f6f3', 100: '#ebe8e1', 300: '#c9c2b2', 500: '#6f6858', 700: '#5a5446', 900: '#2f2c25' },
      },
    },
  },
  plugins: [],
} satisfies Config
