import { beforeAll, describe, expect, it } from "vitest";
import type { BuiltLayout } from "@/lib/layout-versions/build";
import { batchOrders, type BatchingMethod } from "@/lib/batching";
import { DEMO_CART_LIMITS, demoOrders, type DemoItem } from "@/db/seeds/demo/orders";
import { demoLayout } from "./fixture";

let layout: BuiltLayout;
let items: DemoItem[];
beforeAll(async () => {
  ({ layout, items } = await demoLayout());
});

/**
 * A greedy rule has no guarantee of beating first-come on every wave; this checks that it does on the
 * seeded demo weeks. Routes above 14 stops are sequenced by the engine's heuristic to keep the test
 * quick; both methods go through the same planner, so the comparison stays like for like.
 */
describe("route savings against first-come on the demo week", () => {
  const total = (method: BatchingMethod, seed: number) => {
    const orders = demoOrders(items, { days: 5, perDay: 60, seed });
    const r = batchOrders(layout.graph, layout.matrix, orders, DEMO_CART_LIMITS, {
      method,
      from: "D1",
      to: "P1",
      route: { exactLimit: 14 },
    });
    return { mm: r.batches.reduce((s, b) => s + b.route.lengthMm, 0), batches: r.batches.length };
  };

  it.each([1, 2, 3, 4, 5, 6])("never walks more in total (seed %i)", (seed) => {
    const fc = total("first-come", seed);
    const sv = total("savings", seed);
    expect(sv.mm).toBeLessThanOrEqual(fc.mm);
    // Batch counts are not compared: picking by walk can leave a cart short on lines where the queue
    // order would have filled it, so savings occasionally needs one more cart (seed 6: 51 against 50).
  });
});
