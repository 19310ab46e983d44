import { beforeAll, describe, expect, it } from "vitest";
import type { BuiltLayout } from "@/lib/layout-versions/build";
import { planPick } from "@/lib/routing/plan";
import { toStoredBatch } from "@/lib/waves/to-stored";
import type { WaveOrder } from "@/lib/batching/types";
import type { DemoItem } from "@/db/seeds/demo/orders";
import { demoLayout } from "./fixture";

// One order of nine lines on the demo floor, routed twice: by Held–Karp (the default for nine stops)
// and with the exact solver held off. The Held–Karp length is the independent optimum the other
// route's bound must stay under.
let layout: BuiltLayout;
let order: WaveOrder;
beforeAll(async () => {
  let items: DemoItem[];
  ({ layout, items } = await demoLayout());
  const picked = items.filter((_, i) => i % 23 === 0).slice(0, 9);
  order = {
    orderId: 1,
    orderNumber: "FS-TEST-1",
    cutoffAt: null,
    priority: 1,
    lines: picked.map((it, i) => ({
      lineId: 100 + i,
      sku: it.sku,
      binCode: it.binCode,
      quantity: 1,
      unitWeightG: 100,
    })),
  };
});

function stored(exactLimit?: number) {
  const route = planPick(
    layout.graph,
    layout.matrix,
    { from: "D1", to: "P1", binCodes: order.lines.map((l) => l.binCode) },
    { exactLimit },
  );
  const plan = { orders: [order.orderId], lineCount: order.lines.length, weightG: 900, route };
  return { route, batch: toStoredBatch(layout.graph, plan, new Map([[order.orderId, order]])) };
}

describe("a planned batch as the planning job stores it", () => {
  it("carries the route's length, bound and method", () => {
    for (const limit of [undefined, 3]) {
      const { route, batch } = stored(limit);
      expect(batch).toMatchObject({
        distanceMm: route.lengthMm,
        lowerBoundMm: route.lowerBoundMm,
        optimal: route.optimal,
        method: route.method,
      });
    }
  });

  it("a Held–Karp batch's bound is its length; a heuristic batch's bound stays under the Held–Karp optimum", () => {
    const exact = stored().batch;
    expect(exact.method).toBe("held-karp");
    expect(exact.lowerBoundMm).toBe(exact.distanceMm);
    const other = stored(3).batch;
    expect(other.method).not.toBe("held-karp");
    expect(other.distanceMm).toBeGreaterThanOrEqual(exact.distanceMm);
    expect(other.lowerBoundMm).toBeLessThanOrEqual(exact.distanceMm);
    expect(other.lowerBoundMm).toBeGreaterThan(0);
  });
});
