import type { Config } from "tailwindcss";

// Tailwind 4 reads this through `@config` in app/globals.css. Our palette: ink (text), paper
// (surfaces), and two accents used sparingly; plot colours live in lib/workbench/palette.ts.
// Every text colour reaches 4.5:1 (WCAG 2.x AA) on every surface it may sit on; checked in
// tests/unit/theme/contrast.test.ts.
export const themeColors = {
  ink: { DEFAULT: "#1d2433", soft: "#4a5468", faint: "#5c6576" },
  paper: { DEFAULT: "#fbfaf7", raised: "#ffffff", sunk: "#f1efe9" },
  lux: { DEFAULT: "#0f6e6e", dark: "#0a4f4f", light: "#d7ecea" },
  ember: { DEFAULT: "#a0470f", light: "#f7e3d5" },
} as const;

const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: themeColors,
    },
  },
};

export default config;
