import { beforeAll, describe, expect, it } from "vitest";
import type { DemoItem } from "@/db/seeds/demo/orders";
import { demoOrders } from "@/db/seeds/demo/orders";
import type { BuiltLayout } from "@/lib/layout-versions/build";
import { demoLayout } from "./fixture";

let layout: BuiltLayout;
let items: DemoItem[];
beforeAll(async () => {
  ({ layout, items } = await demoLayout());
});

describe("demo item master", () => {
  it("has about 120 distinct SKUs, each in its own bin of the demo layout", () => {
    expect(items.length).toBeGreaterThanOrEqual(110);
    expect(items.length).toBeLessThanOrEqual(130);
    expect(new Set(items.map((i) => i.sku)).size).toBe(items.length);
    expect(new Set(items.map((i) => i.binCode)).size).toBe(items.length);
    const codes = new Set(layout.graph.bins.map((b) => b.code));
    for (const it of items) expect(codes.has(it.binCode), it.binCode).toBe(true);
  });

  it("keeps items of 2 kg and more on the lowest level", () => {
    const level = new Map(layout.graph.bins.map((b) => [b.code, b.level]));
    const heavy = items.filter((i) => i.unitWeightG >= 2000);
    expect(heavy.length).toBeGreaterThan(0);
    for (const it of heavy) expect(level.get(it.binCode), it.sku).toBe(1);
  });

  it("uses the four units of measure with positive weights", () => {
    expect(new Set(items.map((i) => i.unitOfMeasure))).toEqual(new Set(["EA", "BOX", "PK", "M"]));
    for (const it of items) expect(it.unitWeightG).toBeGreaterThan(0);
  });
});

describe("demo orders", () => {
  it("are the same for the same seed and differ for another", () => {
    expect(demoOrders(items, { seed: 3 })).toEqual(demoOrders(items, { seed: 3 }));
    expect(demoOrders(items, { seed: 3 })).not.toEqual(demoOrders(items, { seed: 4 }));
  });

  it("cover the week with numbered orders of 1–8 lines, priorities 1–3 and same-day cut-offs", () => {
    const orders = demoOrders(items, { days: 5, perDay: 60, seed: 1 });
    expect(orders).toHaveLength(300);
    expect(new Set(orders.map((o) => o.orderNumber)).size).toBe(300);
    expect(new Set(orders.map((o) => o.orderId)).size).toBe(300);
    expect(orders[0]?.orderNumber).toBe("FS-261123-0001");
    expect(orders[299]?.orderNumber).toBe("FS-261127-0060");
    const known = new Map(items.map((i) => [i.sku, i]));
    for (const o of orders) {
      expect(o.orderNumber).toMatch(/^FS-\d{6}-\d{4}$/);
      expect(o.lines.length).toBeGreaterThanOrEqual(1);
      expect(o.lines.length).toBeLessThanOrEqual(8);
      expect(new Set(o.lines.map((l) => l.sku)).size).toBe(o.lines.length);
      expect([1, 2, 3]).toContain(o.priority);
      if (o.cutoffAt !== null) {
        const day = `20${o.orderNumber.slice(3, 5)}-${o.orderNumber.slice(5, 7)}-${o.orderNumber.slice(7, 9)}`;
        expect(o.cutoffAt.slice(0, 10)).toBe(day);
        expect(Number.isNaN(Date.parse(o.cutoffAt))).toBe(false);
      }
      for (const l of o.lines) {
        expect(l.quantity).toBeGreaterThan(0);
        expect(known.get(l.sku)?.binCode).toBe(l.binCode);
        expect(known.get(l.sku)?.unitWeightG).toBe(l.unitWeightG);
      }
    }
    expect(new Set(orders.map((o) => o.lines.length)).size).toBe(8);
    expect(orders.some((o) => o.cutoffAt === null)).toBe(true);
    const lineIds = orders.flatMap((o) => o.lines.map((l) => l.lineId));
    expect(new Set(lineIds).size).toBe(lineIds.length);
  });
});
