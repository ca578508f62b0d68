import type { Config } from 'tailwindcss'

// Our own palette: slate ink on warm paper, with one 8-hue element palette (see shared/board/palette.ts).
export default {
  content: ['./components/**/*.vue', './pages/**/*.vue', './layouts/**/*.vue', './app.vue', './error.vue'],
  theme: {
    extend: {
      fontFamily: { sans: ['"Work Sans"', 'system-ui', 'sans-serif'] },
      colors: {
        paper: '#f7f5f0',
        ink: { DEFAULT: '#2b2f36', soft: '#5b616b', faint: '#9aa0a8' },
        tealgrid: '#2f8f8a',
        accent: '#c2410c',
      },
    },
  },
} satisfies Config
