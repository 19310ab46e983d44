import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { certificateText, degreeBound, gapPercent, heldKarp } from "../../lib/routing";
import { randomInstance } from "./helpers/instances";

// Held–Karp is the exact optimum (checked against brute force in brute-force.test.ts); a bound must never pass it.
describe("degree bound", () => {
  it("is never above the Held–Karp optimum (fast-check, open and closed walks, asymmetric costs)", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 10 }),
        fc.integer({ min: 1, max: 10_000 }),
        fc.boolean(),
        fc.boolean(),
        (m, seed, symmetric, closed) => {
          const cm = randomInstance(m + 2, seed, symmetric);
          const stops = Array.from({ length: m }, (_, i) => i + 2);
          const end = closed ? 0 : 1;
          expect(degreeBound(cm, 0, end, stops)).toBeLessThanOrEqual(heldKarp(cm, 0, end, stops).length);
        },
      ),
      { numRuns: 200 },
    );
  });
});

describe("certificate text", () => {
  it("says proved when the bound reaches the length, and rounds a gap up", () => {
    expect(certificateText({ method: "held-karp", lengthMm: 5000, lowerBoundMm: 5000 })).toBe(
      "shortest — proved by Held–Karp",
    );
    expect(gapPercent({ lengthMm: 1001, lowerBoundMm: 1000 })).toBe(0.1);
    expect(certificateText({ method: "local-search", lengthMm: 1030, lowerBoundMm: 1000 })).toMatch(
      /^at most 3 % above/,
    );
    expect(gapPercent({ lengthMm: 10, lowerBoundMm: 0 })).toBe(Infinity);
  });
});
