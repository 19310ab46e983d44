"use client";
import { createContext, useContext } from "react";
import { DEFAULT_DATE_STYLE, type DateStyle } from "@/lib/format/dates";

// The site's date style reaches every client component from the app shell, so no screen picks its own.
const DateStyleContext = createContext<DateStyle>(DEFAULT_DATE_STYLE);

export function SiteFormatProvider({ dateStyle, children }: { dateStyle: DateStyle; children: React.ReactNode }) {
  return <DateStyleContext.Provider value={dateStyle}>{children}</DateStyleContext.Provider>;
}

/** The site's time zone, date order and clock, for formatDateTime() and friends in lib/format/dates. */
export const useDateStyle = () => useContext(DateStyleContext);
