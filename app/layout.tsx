import type { Metadata, Viewport } from "next";
import { trailbinFont } from "./fonts";
import "./globals.css";

export const metadata: Metadata = {
  title: { default: "Trailbin", template: "%s · Trailbin" },
  description: "Shorter walks for order pickers: floor plans, waves and exact pick routes.",
};

export const viewport: Viewport = { width: "device-width", initialScale: 1, themeColor: "#0e6b58" };

export default function RootLayout({ children }: { children: React.ReactNode }) {
  return (
    <html lang="en" className={trailbinFont.variable}>
      <body>{children}</body>
    </html>
  );
}
