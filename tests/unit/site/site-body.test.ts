import { describe, expect, it } from "vitest";
import { isTimeZone, timeZoneNames } from "@/lib/format/time-zones";
import { differingFields, SiteChangeBody } from "@/lib/site/site-body";
import type { SiteDTO } from "@/lib/contracts/site";

describe("time zones", () => {
  it("takes IANA names, UTC and old aliases, and refuses offsets, abbreviations and inventions", () => {
    for (const z of ["UTC", "Europe/London", "America/Argentina/Buenos_Aires", "Etc/GMT+5", "Europe/Kiev"])
      expect(isTimeZone(z), z).toBe(true);
    for (const z of ["", "+01:00", "CET", "EST", "Europe/Atlantis", "utc ", "../../etc/passwd"])
      expect(isTimeZone(z), z).toBe(false);
  });
  it("offers UTC first and every name it offers passes", () => {
    const names = timeZoneNames();
    expect(names[0]).toBe("UTC");
    expect(names.length).toBeGreaterThan(300);
    expect(names.filter((z) => !isTimeZone(z))).toEqual([]);
  });
});

describe("the settings body", () => {
  it("takes walking speed in m/s within 0.3–2.5 and the cap within 1–10", () => {
    expect(SiteChangeBody.safeParse({ version: 1, walkingSpeedMPerS: 0.3 }).success).toBe(true);
    expect(SiteChangeBody.safeParse({ version: 1, walkingSpeedMPerS: 2.51 }).success).toBe(false);
    expect(SiteChangeBody.safeParse({ version: 1, maxOpenBatchesPerPicker: 10 }).success).toBe(true);
    expect(SiteChangeBody.safeParse({ version: 1, maxOpenBatchesPerPicker: 0 }).success).toBe(false);
    expect(SiteChangeBody.safeParse({ version: 1, setupSecondsPerBatch: 0 }).success).toBe(true);
    expect(SiteChangeBody.safeParse({ version: 1, setupSecondsPerBatch: 1.5 }).success).toBe(false);
  });
});

describe("what a refused save is told", () => {
  const stored = {
    name: "Bramblegate",
    timezone: "Europe/London",
    walkingSpeedMmPerS: 1200,
    secondsPerLine: 15,
    setupSecondsPerBatch: 120,
    maxOpenBatchesPerPicker: 3,
    dateOrder: "dmy",
    clock: "24h",
    units: "metric",
  } as SiteDTO;
  it("names only the asked-for settings the stored site has otherwise", () => {
    expect(differingFields(stored, { walkingSpeedMPerS: 1, secondsPerLine: 15, clock: "12h" })).toEqual([
      "walking speed",
      "clock",
    ]);
    expect(differingFields(stored, { walkingSpeedMPerS: 1.2, name: "Bramblegate" })).toEqual([]);
  });
});
