import type { Config } from "tailwindcss";

/**
 * Shearwire's look: graphite ink on a pale mill-scale ground, one cool accent ("edge", the
 * bright line of a fresh cut) and one warm colour kept for cautions.
 */
export default {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        ink: { DEFAULT: "#161b22", soft: "#2a313c", muted: "#5b6573" },
        scale: { 50: "#f6f7f8", 100: "#eceef1", 200: "#d9dde3", 300: "#bcc3cc", 400: "#8d97a4" },
        // #0b777c: 5.3:1 on white and 5.0:1 on scale-50 (links and white-on-edge buttons reach WCAG AA's 4.5:1)
        edge: { DEFAULT: "#0b777c", light: "#d5f0f0", dark: "#0a6267" },
        caution: { DEFAULT: "#c77c02", light: "#fff3d6", dark: "#7a4b00" },
        fault: { DEFAULT: "#b42318", light: "#fde7e4" },
        ok: { DEFAULT: "#1f7a3f", light: "#e2f4e8" },
      },
      fontFamily: {
        sans: ["var(--font-sans)", "system-ui", "sans-serif"],
        mono: ["var(--font-mono)", "ui-monospace", "monospace"],
      },
    },
  },
} satisfies Config;
