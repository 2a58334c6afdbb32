import type { Config } from "tailwindcss";

// Sealpitch's own visual identity. The palette is built around three ideas of the trade:
// "ink" (drawing-office blue-black for text and lines), "steel" (neutral greys for surfaces),
// and "brass" (the warm accent of fittings, used for actions and the selected bolt).
// Verdict colours are kept apart from the accent so a pass/warn/fail never reads as a button.
const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./features/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        ink: {
          50: "#f3f5f8",
          100: "#e2e7ef",
          200: "#c3ccdb",
          300: "#98a6bf",
          400: "#6b7c9c",
          500: "#4c5d7d",
          600: "#394864",
          700: "#2b3850",
          800: "#1d2739",
          900: "#121a28",
        },
        steel: {
          50: "#f7f7f5",
          100: "#eeeeea",
          200: "#dcdcd5",
          300: "#c2c2b8",
          400: "#9d9d91",
          500: "#7a7a6f",
        },
        brass: {
          50: "#fdf7ec",
          100: "#f8e8c9",
          300: "#e7bd6e",
          500: "#c98d2b",
          600: "#a8701c",
          700: "#845616",
        },
        verdict: {
          pass: "#2f7d4f",
          "pass-bg": "#e4f3ea",
          warn: "#a86a00",
          "warn-bg": "#fbf0d9",
          fail: "#b3261e",
          "fail-bg": "#fbe4e2",
          na: "#6b7c9c",
          "na-bg": "#eceff4",
        },
      },
      fontFamily: {
        sans: ["var(--font-plex-sans)", "system-ui", "sans-serif"],
        mono: ["var(--font-plex-mono)", "ui-monospace", "monospace"],
      },
      fontSize: {
        // A compact engineering scale: dense tables at 13 px, body at 15 px, one display size.
        micro: ["0.6875rem", { lineHeight: "1rem" }],
        table: ["0.8125rem", { lineHeight: "1.25rem" }],
        body: ["0.9375rem", { lineHeight: "1.5rem" }],
        lead: ["1.125rem", { lineHeight: "1.75rem" }],
        heading: ["1.375rem", { lineHeight: "1.875rem" }],
        display: ["2.25rem", { lineHeight: "2.625rem", letterSpacing: "-0.01em" }],
      },
      spacing: {
        // Named layout steps on top of Tailwind's default 4 px scale.
        gutter: "1.5rem",
        rail: "15rem",
        // Inner padding of a panel (p-panel).
        panel: "1rem",
      },
      borderRadius: {
        plate: "0.375rem",
      },
      boxShadow: {
        plate: "0 1px 2px rgba(18, 26, 40, 0.08), 0 0 0 1px rgba(18, 26, 40, 0.06)",
      },
    },
  },
};

export default config;
