import type { Config } from "tailwindcss";

// Duffbank's own palette: forest-floor browns and a moss green, with a leaf-litter amber
// for calls to action. Contrast pairs used for text were checked at WCAG AA (4.5:1).
const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        humus: {
          50: "#f7f3ee",
          100: "#ece3d6",
          200: "#d9c6ad",
          300: "#c0a27f",
          400: "#a27f58",
          500: "#84633f",
          600: "#6a4e31",
          700: "#523c27",
          800: "#3b2b1d",
          900: "#271c13",
        },
        moss: {
          50: "#f1f6ee",
          100: "#dde9d5",
          200: "#bcd4ac",
          300: "#94b97c",
          400: "#6f9b55",
          500: "#537e3c",
          600: "#40642e",
          700: "#324e25",
          800: "#263b1d",
          900: "#1a2914",
        },
        litter: {
          100: "#fbefd5",
          300: "#f0c36b",
          500: "#d9962b",
          700: "#93600f",
        },
        ember: { 100: "#fbe3dc", 600: "#b3401f", 800: "#7a2a13" },
      },
      fontFamily: {
        sans: ["var(--font-work-sans)", "ui-sans-serif", "system-ui", "sans-serif"],
      },
      borderRadius: { leaf: "1.25rem 0.375rem 1.25rem 0.375rem" },
    },
  },
};

export default config;
