import { describe, expect, it } from "vitest";
import { perOrderTrips, summarisePlan } from "@/lib/waves/plan-summary";
import type { StoredBatch } from "@/lib/contracts/batches";

// A worked example by hand. Three orders: 10 has lines 101 and 102, 20 has line 201, 30 has lines
// 301–303. Picked one per trip their shortest walks are 40 m, 30 m and 50 m (120 m in all). The plan
// puts orders 10 and 20 on one cart (60 m, usual walk 70 m) and order 30 alone (50 m, usual 55 m).
// At 1 m/s, 15 s a line and 60 s set-up per cart: the plan takes 60 + 3·15 + 60 + 50 + 3·15 + 60
// = 320 s; order by order 40 + 2·15 + 60 + 30 + 15 + 60 + 50 + 3·15 + 60 = 390 s (the same lines,
// 10 m more walking and one cart more to set up).
const orderOfLine = new Map([
  [101, 10],
  [102, 10],
  [201, 20],
  [301, 30],
  [302, 30],
  [303, 30],
]);

function batch(distanceMm: number, baselineMm: number, lines: [number, number][], optimal = true): StoredBatch {
  return {
    lineCount: lines.length,
    toteCount: new Set(lines.map(([, tote]) => tote)).size,
    weightG: 1000,
    distanceMm,
    baselineMm,
    lowerBoundMm: optimal ? distanceMm : 0,
    optimal,
    method: optimal ? "held-karp" : "local-search",
    stops: [],
    lines: lines.map(([orderLineId, tote], i) => ({ orderLineId, tote, stopSeq: i + 1, binCode: `B${orderLineId}` })),
  };
}

const trips = perOrderTrips(
  [
    batch(40_000, 41_000, [
      [101, 1],
      [102, 1],
    ]),
    batch(30_000, 30_000, [[201, 1]]),
    batch(50_000, 55_000, [
      [301, 1],
      [302, 1],
      [303, 1],
    ]),
  ],
  orderOfLine,
);
const plan = [
  batch(60_000, 70_000, [
    [101, 1],
    [102, 1],
    [201, 2],
  ]),
  batch(50_000, 55_000, [
    [301, 1],
    [302, 1],
    [303, 1],
  ]),
];
const timing = { walkingSpeedMmPerS: 1000, secondsPerLine: 15, setupSecondsPerBatch: 60 };

describe("a compared plan's summary", () => {
  it("matches the worked example: walks, both baselines and both estimates", () => {
    expect(summarisePlan(plan, 0, trips, orderOfLine, timing)).toEqual({
      batches: 2,
      orders: 3,
      lines: 6,
      totes: 3,
      unbatchedOrders: 0,
      distanceMm: 110_000,
      usualWalkMm: 125_000,
      orderByOrderMm: 120_000,
      orderByOrderOptimal: true,
      estimatedSeconds: 320,
      orderByOrderSeconds: 390,
      timing,
    });
  });

  // Orders 10 and 20 alone: 40 + 30 m walking, 3 lines · 15 s, 2 set-ups · 60 s = 235 s.
  it("counts order by order only over the orders the plan batched", () => {
    const s = summarisePlan(plan.slice(0, 1), 1, trips, orderOfLine, timing);
    expect(s).toMatchObject({ orders: 2, unbatchedOrders: 1, orderByOrderMm: 70_000, orderByOrderSeconds: 235 });
  });

  it("says when an order's own trip was not proved shortest", () => {
    const heuristic = perOrderTrips([batch(30_000, 30_000, [[201, 1]], false)], orderOfLine);
    const s = summarisePlan([batch(30_000, 30_000, [[201, 1]])], 0, heuristic, orderOfLine, timing);
    expect(s.orderByOrderOptimal).toBe(false);
  });

  it("refuses a plan holding an order that had no trip of its own, rather than understate order by order", () => {
    expect(() => summarisePlan(plan, 0, new Map(), orderOfLine, timing)).toThrow(/order 10/);
  });
});
