/** Metres with one decimal, as pickers and planners talk about walks. */
export const metres = (mm: number) => `${(mm / 1000).toLocaleString("en-GB", { maximumFractionDigits: 1 })} m`;

export function minutes(seconds: number): string {
  const m = Math.round(seconds / 60);
  return m < 60 ? `${m} min` : `${Math.floor(m / 60)} h ${m % 60} min`;
}

export const kilograms = (g: number) => `${(g / 1000).toLocaleString("en-GB", { maximumFractionDigits: 1 })} kg`;

/** Share of the baseline walk saved, e.g. "12.3 %"; empty baseline → "—". */
export function savingsPct(distanceMm: number, baselineMm: number): string {
  if (!(baselineMm > 0)) return "—";
  return `${(Math.round((1 - distanceMm / baselineMm) * 1000) / 10).toLocaleString("en-GB")} %`;
}

/** A distance in the site's units: metres, or whole feet at an imperial site. */
export const distance = (mm: number, units: "metric" | "imperial" = "metric") =>
  units === "imperial" ? `${Math.round(mm / 304.8).toLocaleString("en-GB")} ft` : metres(mm);
