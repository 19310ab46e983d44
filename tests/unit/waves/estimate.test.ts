import { describe, expect, it } from "vitest";
import { DEFAULT_SITE_TIMING, estimateSeconds } from "@/lib/batching/estimate";

describe("estimateSeconds", () => {
  it("adds walking time at the walking speed to a fixed time per line", () => {
    // 120 m at 1 m/s is 120 s; 10 lines at 15 s are 150 s.
    expect(estimateSeconds({ distanceMm: 120_000, lines: 10 })).toBe(270);
    expect(estimateSeconds({ distanceMm: 120_000, lines: 10 }, { walkingSpeedMmPerS: 800, secondsPerLine: 12 })).toBe(
      150 + 120,
    );
  });

  it("uses 1 m/s and 15 s per line by default", () => {
    expect(DEFAULT_SITE_TIMING).toEqual({ walkingSpeedMmPerS: 1000, secondsPerLine: 15 });
    expect(estimateSeconds({ distanceMm: 0, lines: 0 })).toBe(0);
    expect(estimateSeconds({ distanceMm: 1500, lines: 0 })).toBe(1.5);
  });

  it("refuses a speed of zero and negative inputs", () => {
    expect(() => estimateSeconds({ distanceMm: 1, lines: 1 }, { walkingSpeedMmPerS: 0, secondsPerLine: 15 })).toThrow(
      RangeError,
    );
    expect(() => estimateSeconds({ distanceMm: -1, lines: 1 })).toThrow(RangeError);
    expect(() =>
      estimateSeconds({ distanceMm: 1, lines: 1 }, { walkingSpeedMmPerS: 1000, secondsPerLine: -1 }),
    ).toThrow(RangeError);
  });
});
