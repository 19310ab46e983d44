import { describe, expect, it } from "vitest";
import {
  DEFAULT_SITE_TIMING,
  estimateSeconds,
  setupText,
  siteTiming,
  speedText,
  timingNote,
} from "@/lib/batching/estimate";

// Worked example, by hand, with the default figures (common practice, not measured at any site:
// about 1 m/s pushing a cart, 15 s per pick line, 2 min to collect a cart with its totes at the depot
// and drop it at packing):
//   a batch of 240 m and 18 lines
//   walking   240 000 mm / 1 000 mm/s = 240 s
//   handling  18 lines × 15 s         = 270 s
//   set-up    once per batch          = 120 s
//   estimate                          = 630 s = 10 min 30 s
// A site with its own figures (0.8 m/s, 12 s per line, 90 s set-up), a batch of 120 m and 10 lines:
//   120 000 / 800 = 150 s; 10 × 12 = 120 s; + 90 s = 360 s = 6 min.

describe("estimateSeconds", () => {
  it("matches the worked example with the default figures (common practice)", () => {
    expect(DEFAULT_SITE_TIMING).toEqual({ walkingSpeedMmPerS: 1000, secondsPerLine: 15, setupSecondsPerBatch: 120 });
    expect(estimateSeconds({ distanceMm: 240_000, lines: 18 })).toBe(630);
    expect(estimateSeconds({ distanceMm: 240_000, lines: 18 }, siteTiming(null))).toBe(630);
  });

  it("matches the worked example with a site's own figures", () => {
    const site = { walkingSpeedMmPerS: 800, secondsPerLine: 12, setupSecondsPerBatch: 90 };
    expect(estimateSeconds({ distanceMm: 120_000, lines: 10 }, site)).toBe(360);
  });

  it("adds the set-up once per batch, even to an empty one, and none when a timing leaves it out", () => {
    expect(estimateSeconds({ distanceMm: 0, lines: 0 })).toBe(120);
    expect(estimateSeconds({ distanceMm: 1500, lines: 0 }, { walkingSpeedMmPerS: 1000, secondsPerLine: 15 })).toBe(1.5);
  });

  it("takes each of a site's figures and fills in the defaults for missing ones", () => {
    expect(siteTiming({ walkingSpeedMmPerS: 900 })).toEqual({
      walkingSpeedMmPerS: 900,
      secondsPerLine: 15,
      setupSecondsPerBatch: 120,
    });
    expect(siteTiming({ setupSecondsPerBatch: 0, secondsPerLine: 20 }).setupSecondsPerBatch).toBe(0);
  });

  it("refuses a speed of zero and negative inputs", () => {
    expect(() => estimateSeconds({ distanceMm: 1, lines: 1 }, { walkingSpeedMmPerS: 0, secondsPerLine: 15 })).toThrow(
      RangeError,
    );
    expect(() => estimateSeconds({ distanceMm: -1, lines: 1 })).toThrow(RangeError);
    expect(() =>
      estimateSeconds({ distanceMm: 1, lines: 1 }, { walkingSpeedMmPerS: 1000, secondsPerLine: -1 }),
    ).toThrow(RangeError);
    expect(() =>
      estimateSeconds({ distanceMm: 1, lines: 1 }, { ...DEFAULT_SITE_TIMING, setupSecondsPerBatch: -5 }),
    ).toThrow(RangeError);
  });
});

describe("the note beside every estimate", () => {
  it("names the three figures it uses", () => {
    expect(timingNote(DEFAULT_SITE_TIMING)).toBe(
      "at 1.0 m/s walking, 15 s per line, 2 min set-up per batch (site settings)",
    );
    expect(timingNote({ walkingSpeedMmPerS: 1250, secondsPerLine: 12, setupSecondsPerBatch: 90 })).toBe(
      "at 1.25 m/s walking, 12 s per line, 1 min 30 s set-up per batch (site settings)",
    );
  });
  it("says speed in feet per second at an imperial site (1 ft = 304.8 mm)", () => {
    // 1000 / 304.8 = 3.28 ft/s
    expect(speedText(1000, "imperial")).toBe("3.28 ft/s");
    expect(speedText(700)).toBe("0.7 m/s");
    expect(setupText(45)).toBe("45 s");
    expect(setupText(0)).toBe("0 s");
  });
});
