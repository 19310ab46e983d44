import type { Metadata, Viewport } from "next";
import { connection } from "next/server";
import { trailbinFont } from "./fonts";
import "./globals.css";

export const metadata: Metadata = {
  title: { default: "Trailbin", template: "%s · Trailbin" },
  description: "Shorter walks for order pickers: floor plans, waves and exact pick routes.",
};

export const viewport: Viewport = { width: "device-width", initialScale: 1, themeColor: "#0e6b58" };

export default async function RootLayout({ children }: { children: React.ReactNode }) {
  // Every page renders per request: its scripts carry the nonce proxy.ts put in this response's CSP,
  // and a page prerendered at build time would carry none and not run.
  await connection();
  return (
    <html lang="en" className={trailbinFont.variable}>
      <body>{children}</body>
    </html>
  );
}
