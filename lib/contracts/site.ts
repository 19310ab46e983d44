import type { Clock, DateOrder, DateStyle } from "@/lib/format/dates";

// The site's own figures as the settings API and screens see them.

export const UNITS = ["metric", "imperial"] as const;
export type Units = (typeof UNITS)[number];

/** What an admin may set, in the units people think in; the API refuses anything outside. */
export const SITE_LIMITS = {
  nameMax: 120,
  walkingSpeedMPerS: { min: 0.3, max: 2.5 },
  secondsPerLine: { min: 1, max: 600 },
  setupSecondsPerBatch: { min: 0, max: 3600 },
  maxOpenBatchesPerPicker: { min: 1, max: 10 },
} as const;

export type SiteDTO = {
  id: number;
  code: string;
  name: string;
  timezone: string;
  walkingSpeedMmPerS: number;
  secondsPerLine: number;
  /** Collecting a cart and its totes at the depot and dropping them at packing, once per batch. */
  setupSecondsPerBatch: number;
  maxOpenBatchesPerPicker: number;
  dateOrder: DateOrder;
  clock: Clock;
  units: Units;
  /** How every screen, mail and print writes this site's dates and times. */
  dateStyle: DateStyle;
  version: number;
};

/** A change to the settings; walking speed in m/s as people enter it (stored as mm/s). */
export type SiteChange = Partial<
  Pick<
    SiteDTO,
    | "name"
    | "timezone"
    | "secondsPerLine"
    | "setupSecondsPerBatch"
    | "maxOpenBatchesPerPicker"
    | "dateOrder"
    | "clock"
    | "units"
  > & { walkingSpeedMPerS: number }
>;
