import localFont from "next/font/local";

// Shipped with the app (no font CDN on a warehouse network); a typeface drawn for legibility at a glance.
export const trailbinFont = localFont({
  src: [
    {
      path: "../node_modules/@fontsource-variable/atkinson-hyperlegible-next/files/atkinson-hyperlegible-next-latin-wght-normal.woff2",
      style: "normal",
    },
    {
      path: "../node_modules/@fontsource-variable/atkinson-hyperlegible-next/files/atkinson-hyperlegible-next-latin-wght-italic.woff2",
      style: "italic",
    },
  ],
  weight: "200 800",
  variable: "--font-trailbin",
  display: "swap",
});
