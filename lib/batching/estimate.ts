/** How fast a site's pickers work; used to turn a planned walk into minutes. */
export type SiteTiming = {
  walkingSpeedMmPerS: number;
  secondsPerLine: number;
};

/**
 * Common practice, not measured at any site: a picker pushing a cart walks about 1 m/s, and a pick
 * line takes about 10–20 s including finding the bin, picking and confirming. Sites should replace
 * both with their own time studies.
 */
export const DEFAULT_SITE_TIMING: SiteTiming = { walkingSpeedMmPerS: 1000, secondsPerLine: 15 };
// The sites table's column defaults (migration 20261202000200) hold the same two figures; a landed
// migration never changes, so a new default here needs a new migration for that table too.

/** A site's own timing, or the defaults for a site that has none (or is not found). */
export function siteTiming(site: Partial<SiteTiming> | null | undefined): SiteTiming {
  return {
    walkingSpeedMmPerS: site?.walkingSpeedMmPerS ?? DEFAULT_SITE_TIMING.walkingSpeedMmPerS,
    secondsPerLine: site?.secondsPerLine ?? DEFAULT_SITE_TIMING.secondsPerLine,
  };
}

/** Walking time plus handling time per line. */
export function estimateSeconds(
  work: { distanceMm: number; lines: number },
  timing: SiteTiming = DEFAULT_SITE_TIMING,
): number {
  if (!(timing.walkingSpeedMmPerS > 0)) throw new RangeError("walking speed must be positive");
  if (!(timing.secondsPerLine >= 0)) throw new RangeError("seconds per line must not be negative");
  if (!(work.distanceMm >= 0) || !(work.lines >= 0)) throw new RangeError("distance and lines must not be negative");
  return work.distanceMm / timing.walkingSpeedMmPerS + work.lines * timing.secondsPerLine;
}
