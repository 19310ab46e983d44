/** How fast a site's pickers work; used to turn a planned walk into minutes. */
export type SiteTiming = {
  walkingSpeedMmPerS: number;
  secondsPerLine: number;
  /**
   * Fixed time every batch costs besides walking and picking: collecting a cart and its totes at the
   * depot and dropping them at packing. A timing written without it adds none.
   */
  setupSecondsPerBatch?: number;
};

/**
 * Common practice, not measured at any site: a picker pushing a cart walks about 1 m/s, a pick line
 * takes about 10–20 s including finding the bin, picking and confirming, and collecting a cart with
 * its totes and handing it over at packing takes about 2 minutes a batch. Sites should replace all
 * three with their own time studies (Site settings).
 */
export const DEFAULT_SITE_TIMING: Required<SiteTiming> = {
  walkingSpeedMmPerS: 1000,
  secondsPerLine: 15,
  setupSecondsPerBatch: 120,
};
// The sites table's column defaults (migrations 20261202000200 and 20261205200100) hold the same
// figures; a landed migration never changes, so a new default here needs a new migration too.

/** A site's own timing, or the defaults for a site that has none (or is not found). */
export function siteTiming(site: Partial<SiteTiming> | null | undefined): Required<SiteTiming> {
  return {
    walkingSpeedMmPerS: site?.walkingSpeedMmPerS ?? DEFAULT_SITE_TIMING.walkingSpeedMmPerS,
    secondsPerLine: site?.secondsPerLine ?? DEFAULT_SITE_TIMING.secondsPerLine,
    setupSecondsPerBatch: site?.setupSecondsPerBatch ?? DEFAULT_SITE_TIMING.setupSecondsPerBatch,
  };
}

/** One batch: walking time at the walking speed, handling time per line, and the set-up per batch. */
export function estimateSeconds(
  work: { distanceMm: number; lines: number },
  timing: SiteTiming = DEFAULT_SITE_TIMING,
): number {
  const setup = timing.setupSecondsPerBatch ?? 0;
  if (!(timing.walkingSpeedMmPerS > 0)) throw new RangeError("walking speed must be positive");
  if (!(timing.secondsPerLine >= 0)) throw new RangeError("seconds per line must not be negative");
  if (!(setup >= 0)) throw new RangeError("set-up time per batch must not be negative");
  if (!(work.distanceMm >= 0) || !(work.lines >= 0)) throw new RangeError("distance and lines must not be negative");
  return work.distanceMm / timing.walkingSpeedMmPerS + work.lines * timing.secondsPerLine + setup;
}

/** "2 min", "1 min 30 s", "45 s": a set-up time as people say it. */
export function setupText(seconds: number): string {
  const m = Math.floor(seconds / 60);
  const s = Math.round(seconds % 60);
  if (m === 0) return `${s} s`;
  return s === 0 ? `${m} min` : `${m} min ${s} s`;
}

/** Walking speed as people say it: "1.0 m/s", or "3.3 ft/s" at an imperial site. */
export function speedText(mmPerS: number, units: "metric" | "imperial" = "metric"): string {
  const hundredths = Math.round((units === "imperial" ? mmPerS / 304.8 : mmPerS / 1000) * 100);
  // One decimal at least ("1.0 m/s"), two when the site set them ("1.25 m/s").
  const text = (hundredths / 100).toFixed(hundredths % 10 === 0 ? 1 : 2);
  return `${text} ${units === "imperial" ? "ft/s" : "m/s"}`;
}

/** Which figures an estimate uses, said beside every estimate shown. */
export function timingNote(timing: SiteTiming, units: "metric" | "imperial" = "metric"): string {
  return (
    `at ${speedText(timing.walkingSpeedMmPerS, units)} walking, ${timing.secondsPerLine} s per line, ` +
    `${setupText(timing.setupSecondsPerBatch ?? 0)} set-up per batch (site settings)`
  );
}
