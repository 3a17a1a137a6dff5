import type { Config } from "tailwindcss";

// Quireline's palette: uncoated paper, a green-black ink, a persimmon accent, a teal and a mustard
// second ink, and the proof-line colours used on thumbnails (trim, bleed, safe area).
// Faint ink and persimmon are dark enough for WCAG 2.2 AA text contrast on paper (and paper text on
// persimmon); tests/unit/contrast.test.ts computes the ratios of the pairs the screens use.
export default {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        paper: { DEFAULT: "#f6f1e6", deep: "#ece4d2", edge: "#d9cfb8" },
        ink: { DEFAULT: "#1f2a24", soft: "#4a5249", faint: "#61665f" },
        persimmon: { DEFAULT: "#b74a34", dark: "#9e3f2b", light: "#f2d4c9" },
        teal: { DEFAULT: "#2a6f6b", dark: "#1d4f4c", light: "#d3e8e5" },
        mustard: { DEFAULT: "#d9a441", light: "#f6e6c2" },
        line: { trim: "#c8553d", bleed: "#2a6f6b", safe: "#d9a441" },
      },
      fontFamily: {
        display: ["var(--font-display)", "Georgia", "serif"],
        sans: ["var(--font-sans)", "system-ui", "sans-serif"],
        mono: ["var(--font-mono)", "ui-monospace", "monospace"],
      },
    },
  },
} satisfies Config;
