import { describe, expect, it } from "vitest";
import { batchRowOf, batchSummaryOf } from "@/db/batch-rows";
import type { StoredBatch } from "@/lib/contracts/batches";
import { routeCertificateLine } from "@/lib/format/route-certificate";

// A batches row as listBatches selects it (with its counts), and what the pages get from it. The
// expected figures and words are worked by hand from the row.
function row(distance: number, bound: number, method: string) {
  return {
    id: 7,
    wave_id: 3,
    number: 2,
    line_count: 5,
    tote_count: 2,
    weight_g: 4200,
    distance_mm: distance,
    baseline_mm: 120_000,
    lower_bound_mm: bound,
    optimal: 0,
    method,
    status: "planned",
    stop_count: 4,
    picked_count: 1,
    short_count: 0,
  };
}

describe("a batch row as the pages see it", () => {
  it("a Held–Karp route whose bound is its length is proved shortest", () => {
    expect(batchSummaryOf(row(98_000, 98_000, "held-karp"))).toEqual({
      id: 7,
      number: 2,
      lineCount: 5,
      toteCount: 2,
      weightG: 4200,
      stopCount: 4,
      distanceMm: 98_000,
      baselineMm: 120_000,
      lowerBoundMm: 98_000,
      optimal: true,
      method: "held-karp",
      certificate: "shortest — proved by Held–Karp",
      status: "planned",
      pickedLines: 1,
      shortLines: 0,
    });
  });

  it("a local-search route 350 mm over a 10 m bound is at most 3.5 % above the shortest", () => {
    // (10 350 − 10 000) / 10 000 = 3.5 %.
    const b = batchSummaryOf(row(10_350, 10_000, "local-search"));
    expect(b).toMatchObject({ distanceMm: 10_350, lowerBoundMm: 10_000, optimal: false, method: "local-search" });
    expect(b.certificate).toBe("at most 3.5 % above the shortest possible walk (found by local search)");
  });

  it("a gap is rounded up, never down: 10 001 over 10 000 is at most 0.1 %", () => {
    expect(batchSummaryOf(row(10_001, 10_000, "lp-cuts")).certificate).toBe(
      "at most 0.1 % above the shortest possible walk (found by linear programming with subtour cuts)",
    );
  });

  it("a row planned before bounds were stored (bound 0) says it has none", () => {
    const b = batchSummaryOf(row(55_000, 0, "local-search"));
    expect(b.optimal).toBe(false);
    expect(b.certificate).toBe("found by local search; no bound on how far from the shortest it is");
  });

  it("the bound decides `optimal`, whatever the old column says", () => {
    expect(batchSummaryOf({ ...row(40_000, 40_000, "local-search"), optimal: 0 }).optimal).toBe(true);
    expect(batchSummaryOf({ ...row(40_000, 39_000, "held-karp"), optimal: 1 }).optimal).toBe(false);
  });

  it("refuses a method no solver has, rather than print a certificate for it", () => {
    expect(() => batchSummaryOf(row(1000, 1000, "guesswork"))).toThrow(/unknown route method “guesswork”/);
    expect(() => batchSummaryOf(row(1000, 1000, "toString"))).toThrow(/unknown route method/);
  });
});

describe("a planned batch as storePlan writes it", () => {
  const stored: StoredBatch = {
    lineCount: 3,
    toteCount: 1,
    weightG: 900,
    distanceMm: 20_500,
    baselineMm: 30_000,
    lowerBoundMm: 20_000,
    optimal: false,
    method: "local-search",
    stops: [],
    lines: [],
  };

  it("keeps the bound and the method beside the length", () => {
    expect(batchRowOf(3, 1, stored)).toEqual({
      wave_id: 3,
      number: 1,
      line_count: 3,
      tote_count: 1,
      weight_g: 900,
      distance_mm: 20_500,
      baseline_mm: 30_000,
      lower_bound_mm: 20_000,
      optimal: false,
      method: "local-search",
    });
  });

  it("reads back as it was written", () => {
    const b = batchSummaryOf({ ...batchRowOf(3, 1, stored), id: 1, status: "planned", stop_count: 2 });
    expect(b).toMatchObject({ distanceMm: 20_500, lowerBoundMm: 20_000, method: "local-search", optimal: false });
    // (20 500 − 20 000) / 20 000 = 2.5 %.
    expect(b.certificate).toBe("at most 2.5 % above the shortest possible walk (found by local search)");
  });
});

describe("the route line of the batch page and the pick list", () => {
  const base = { optimal: false, certificate: "CERT" };

  it("is the certificate alone when proved or when there is no bound", () => {
    expect(routeCertificateLine({ ...base, optimal: true, lowerBoundMm: 20_500 })).toBe("CERT");
    expect(routeCertificateLine({ ...base, lowerBoundMm: 0 })).toBe("CERT");
  });

  it("states the bound in metres, cut down to the 0.1 m shown so it never claims more", () => {
    // 19 999 mm would round to 20 m; the line says 19.9 m.
    expect(routeCertificateLine({ ...base, lowerBoundMm: 19_999 })).toBe(
      "CERT; no walk through these stops is shorter than 19.9 m",
    );
  });
});
