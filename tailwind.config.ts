import type { Config } from "tailwindcss";

/**
 * Greaseledger's design tokens. Warm paper, graphite ink, a steel blue for structure and an amber
 * for action; states always come with a word and an icon, never colour alone.
 */
const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        paper: { DEFAULT: "#f6f3ec", raised: "#fffdf8", sunk: "#ebe6db" },
        ink: { DEFAULT: "#1f2427", soft: "#4a5257", faint: "#737b80" },
        line: { DEFAULT: "#d5cec0", strong: "#a89f8d" },
        steel: { DEFAULT: "#2c4a5a", dark: "#1d3340", light: "#dbe6ec" },
        amber: { DEFAULT: "#9a5b07", dark: "#7a4705", light: "#f6e6c8" },
        good: { DEFAULT: "#2f6b3a", light: "#dcefdc" },
        caution: { DEFAULT: "#8a6100", light: "#faefcf" },
        bad: { DEFAULT: "#a3302a", light: "#f8dedb" },
      },
      fontFamily: {
        sans: ["var(--font-body)", "system-ui", "sans-serif"],
        mono: ["ui-monospace", "SFMono-Regular", "Menlo", "monospace"],
      },
      fontSize: {
        "2xs": ["0.72rem", { lineHeight: "1rem" }],
        sm: ["0.875rem", { lineHeight: "1.3rem" }],
        base: ["1rem", { lineHeight: "1.55rem" }],
        lg: ["1.15rem", { lineHeight: "1.7rem" }],
        xl: ["1.35rem", { lineHeight: "1.85rem" }],
        "2xl": ["1.7rem", { lineHeight: "2.15rem" }],
      },
      spacing: {
        touch: "3rem",
        gutter: "1.25rem",
      },
      borderRadius: {
        card: "0.6rem",
      },
      boxShadow: {
        card: "0 1px 0 rgba(31,36,39,0.06), 0 1px 3px rgba(31,36,39,0.08)",
      },
    },
  },
};

export default config;
