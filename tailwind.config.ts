import type { Config } from "tailwindcss";

// Lotwarden's design language (§14): calm ink and slate so the data carries the colour; bin colours from the
// Okabe–Ito colour-blind-safe palette (published, Okabe & Ito 2008).
const config: Config = {
  content: ["./src/**/*.{ts,tsx}"],
  theme: {
    extend: {
      fontFamily: {
        sans: ['"IBM Plex Sans"', "system-ui", "sans-serif"],
      },
      colors: {
        ink: { DEFAULT: "#1b2430", soft: "#3a4656", muted: "#5b6878" },
        slate: { rail: "#18202b", line: "#d5dbe3", wash: "#f3f5f8", panel: "#ffffff" },
        accent: { DEFAULT: "#2f5d8a", strong: "#1f4266" },
        alert: { DEFAULT: "#b3261e", wash: "#fbeaea" },
        caution: { DEFAULT: "#8a5a00", wash: "#fff4dc" },
        bin: {
          pass: "#009E73",
          low: "#56B4E9",
          high: "#E69F00",
          open: "#0072B2",
          short: "#D55E00",
          nonlinear: "#CC79A7",
          nodata: "#999999",
        },
      },
    },
  },
};

export default config;
