import { z } from "zod";
import { rowVersion } from "@/lib/http/body-fields";
import { CLOCKS, DATE_ORDERS } from "@/lib/format/dates";
import { isTimeZone } from "@/lib/format/time-zones";
import { SITE_LIMITS as L, UNITS, type SiteChange, type SiteDTO } from "@/lib/contracts/site";

const whole = (what: string, r: { min: number; max: number }, unit: string) =>
  z
    .number({ message: `Enter the ${what} as a number.` })
    .int(`Enter the ${what} in whole ${unit}.`)
    .min(r.min, `The ${what} is at least ${r.min} ${unit}.`)
    .max(r.max, `The ${what} is at most ${r.max} ${unit}.`);

/** PATCH /api/site: the version the admin saw and any of the figures; walking speed in m/s. */
export const SiteChangeBody = z
  .object({
    version: rowVersion(),
    name: z
      .string({ message: "Enter the site's name." })
      .trim()
      .min(1, "Enter the site's name.")
      .max(L.nameMax, `The site's name is at most ${L.nameMax} characters.`)
      .optional(),
    timezone: z
      .string({ message: "Choose the site's time zone from the list." })
      .trim()
      .max(64, "Choose a time zone from the list, such as Europe/London or America/Chicago.")
      .refine(isTimeZone, "Choose a time zone from the list, such as Europe/London or America/Chicago.")
      .optional(),
    walkingSpeedMPerS: z
      .number({ message: "Enter the walking speed in metres per second, such as 1.0." })
      .min(L.walkingSpeedMPerS.min, `Walking speed is at least ${L.walkingSpeedMPerS.min} m/s (a slow stroll).`)
      .max(L.walkingSpeedMPerS.max, `Walking speed is at most ${L.walkingSpeedMPerS.max} m/s (a run with a cart).`)
      .optional(),
    secondsPerLine: whole("time per line", L.secondsPerLine, "seconds").optional(),
    setupSecondsPerBatch: whole("set-up time per batch", L.setupSecondsPerBatch, "seconds").optional(),
    maxOpenBatchesPerPicker: whole("cap of open batches per picker", L.maxOpenBatchesPerPicker, "batches").optional(),
    dateOrder: z.enum(DATE_ORDERS, { message: "Choose day/month/year, month/day/year or year-month-day." }).optional(),
    clock: z.enum(CLOCKS, { message: "Choose a 24-hour or a 12-hour clock." }).optional(),
    units: z.enum(UNITS, { message: "Choose metric or imperial units." }).optional(),
  })
  .strict()
  .refine((b) => Object.keys(b).some((k) => k !== "version"), "Say what to change, such as walkingSpeedMPerS.");

const LABELS: Record<keyof SiteChange, string> = {
  name: "site name",
  timezone: "time zone",
  walkingSpeedMPerS: "walking speed",
  secondsPerLine: "time per line",
  setupSecondsPerBatch: "set-up time per batch",
  maxOpenBatchesPerPicker: "open batches per picker",
  dateOrder: "date order",
  clock: "clock",
  units: "units",
};

/** The settings a refused save asked for that the stored site now has otherwise, in people's words. */
export function differingFields(stored: SiteDTO, change: SiteChange): string[] {
  const now: Required<SiteChange> = {
    name: stored.name,
    timezone: stored.timezone,
    walkingSpeedMPerS: stored.walkingSpeedMmPerS / 1000,
    secondsPerLine: stored.secondsPerLine,
    setupSecondsPerBatch: stored.setupSecondsPerBatch,
    maxOpenBatchesPerPicker: stored.maxOpenBatchesPerPicker,
    dateOrder: stored.dateOrder,
    clock: stored.clock,
    units: stored.units,
  };
  return (Object.keys(LABELS) as (keyof SiteChange)[])
    .filter((k) => change[k] !== undefined && change[k] !== now[k])
    .map((k) => LABELS[k]);
}
