import type { Config } from "tailwindcss";

const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}"],
  theme: {
    extend: {
      fontFamily: { sans: ["var(--font-inter)", "system-ui", "sans-serif"] },
      colors: {
        // Soil and leaf tones of our own; every pairing used for text passes WCAG AA.
        soil: { 50: "#f7f5f2", 100: "#ece7e0", 200: "#d8cfc2", 500: "#8a7660", 700: "#5a4a3a", 900: "#2e261e" },
        leaf: { 50: "#f1f7ef", 100: "#dcebd6", 500: "#4f8a3c", 600: "#3f722f", 700: "#335d27", 900: "#1d3616" },
      },
    },
  },
  plugins: [],
};

export default config;
