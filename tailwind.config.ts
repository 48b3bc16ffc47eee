import type { Config } from 'tailwindcss'

// Polewright's own palette: warm paper, ink, one accent for actions, teal/vermilion/slate for the node kinds.
export default {
  content: ['./app.vue', './error.vue', './pages/**/*.vue', './components/**/*.{vue,ts}', './layouts/**/*.vue'],
  theme: {
    extend: {
      colors: {
        paper: { DEFAULT: '#f7f3ea', deep: '#efe8d9', edge: '#ddd3bf' },
        ink: { DEFAULT: '#1f2328', soft: '#4a4f57', faint: '#80858d' },
        accent: { DEFAULT: '#3d4fd6', dark: '#2f3eb0', light: '#e3e6fb' },
        angle: { DEFAULT: '#0f8b8d', light: '#d5efef' },
        square: { DEFAULT: '#e04e2b', light: '#fbe0d8' },
        block: { DEFAULT: '#52606d', light: '#e4e8ec' },
        // Quark legs and Lines, and their fermion-flow arrows.
        fermion: { DEFAULT: '#7b4a26', light: '#f1e4d6' },
        verdict: { agrees: '#2f7d32', disagrees: '#c62828', boundary: '#b26a00', singular: '#6a1b9a', none: '#6b7280' },
      },
      fontFamily: {
        sans: ['"Space Grotesk"', 'system-ui', 'sans-serif'],
        mono: ['ui-monospace', 'SFMono-Regular', 'Menlo', 'monospace'],
      },
    },
  },
  plugins: [],
} satisfies Config
