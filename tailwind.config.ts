import type { Config } from "tailwindcss";

// Trailbin's palette: warm paper, deep ink and one calm green for the walked trail. Contrast of text on
// paper stays above 7:1 so it reads under warehouse lighting; state is never shown by colour alone.
const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        paper: { DEFAULT: "#f7f5f0", raised: "#ffffff", sunk: "#ebe7de" },
        ink: { DEFAULT: "#16212b", soft: "#3b4a57", faint: "#6b7884" },
        trail: { DEFAULT: "#0e6b58", dark: "#0a4f41", light: "#d3ebe4" },
        signal: { DEFAULT: "#9a4d00", light: "#fbe9d0" },
        alarm: { DEFAULT: "#a4161a", light: "#f9dcdc" },
        rack: { DEFAULT: "#5b6b7a", light: "#dfe4ea" },
      },
      fontFamily: { sans: ["var(--font-trailbin)", "system-ui", "sans-serif"] },
      fontSize: {
        // A step larger than the web's usual scale: read at arm's length on a handheld.
        sm: ["0.9375rem", { lineHeight: "1.4" }],
        base: ["1.0625rem", { lineHeight: "1.55" }],
        lg: ["1.25rem", { lineHeight: "1.45" }],
        xl: ["1.5rem", { lineHeight: "1.3" }],
        "2xl": ["1.875rem", { lineHeight: "1.2" }],
        "3xl": ["2.5rem", { lineHeight: "1.1" }],
      },
      minHeight: { tap: "3rem" },
      minWidth: { tap: "3rem" },
    },
  },
};

export default config;
