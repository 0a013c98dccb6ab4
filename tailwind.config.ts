import type { Config } from "tailwindcss";

// Portfold's design tokens (see the LOOK of the product): defined here once, used as classes everywhere.
export default {
  content: ["./index.html", "./src/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        paper: "#FAF8F3",
        ink: "#1E2430",
        rule: "#E4DED2",
        copper: "#B5562B",
        verdigris: "#2F7D6D",
        signal: "#B3261E",
      },
      fontFamily: {
        sans: ['"IBM Plex Sans"', "system-ui", "sans-serif"],
        mono: ['"IBM Plex Mono"', "ui-monospace", "monospace"],
      },
    },
  },
  plugins: [],
} satisfies Config;
