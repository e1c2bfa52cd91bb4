import type { Config } from 'tailwindcss'

// The notebook palette: warm paper, deep ink, hairline rules. Verdict colours
// are never used alone; each verdict also has a word and a shape
// (app/components/verdict/VerdictMark.vue).
export default {
  content: ['./app/**/*.{vue,ts}'],
  theme: {
    extend: {
      colors: {
        paper: { DEFAULT: '#f6f1e6', deep: '#ede5d3', edge: '#e2d8c2' },
        ink: { DEFAULT: '#1f2633', soft: '#414b5c', faint: '#6b7384' },
        rule: { DEFAULT: '#cdbfa3', strong: '#a8977a' },
        margin: '#b8483b',
        verdict: {
          pass: '#2f6b45',
          fail: '#b03a2e',
          accepted: '#3d5a8c',
          pending: '#7a7466',
          stale: '#9a6a12',
          missing: '#6b5d86',
        },
      },
      fontFamily: {
        serif: ['"Source Serif 4"', 'Georgia', 'serif'],
        mono: ['"Source Code Pro"', 'ui-monospace', 'monospace'],
      },
      borderWidth: { hair: '0.5px' },
    },
  },
} satisfies Config
