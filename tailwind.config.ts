import type { Config } from "tailwindcss";

/** Changewise theme tokens (PRODUCT.md §7), loaded from app/globals.css via @config. */
const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}", "./hooks/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        ink: { DEFAULT: "#1E2A44", soft: "#3B4866", faint: "#586176" },
        gain: { DEFAULT: "#0F766E", soft: "#CCE7E4" },
        decline: { DEFAULT: "#B45309", soft: "#F6DFC7" },
        steady: { DEFAULT: "#64748B", soft: "#E2E6EC" },
        band: "#F3E9D8",
        paper: "#FBFAF7",
        line: "#DAD6CC",
        // Borders of inputs and selects: at least 3 : 1 against white, paper and sand (WCAG 1.4.11).
        control: "#767F94",
      },
      fontFamily: {
        sans: ["Barlow", "system-ui", "sans-serif"],
      },
    },
  },
};

export default config;
