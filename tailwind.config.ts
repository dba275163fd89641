import type { Config } from "tailwindcss";

// Tailwind 4 reads this through `@config` in app/globals.css. Our palette: ink (text), paper
// (surfaces), and two accents used sparingly; plot colours live in components/plots/palette.ts.
const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        ink: { DEFAULT: "#1d2433", soft: "#4a5468", faint: "#8a93a6" },
        paper: { DEFAULT: "#fbfaf7", raised: "#ffffff", sunk: "#f1efe9" },
        lux: { DEFAULT: "#0f6e6e", dark: "#0a4f4f", light: "#d7ecea" },
        ember: { DEFAULT: "#b4541a", light: "#f7e3d5" },
      },
    },
  },
};

export default config;
