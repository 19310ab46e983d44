import { beforeAll, describe, expect, it } from "vitest";
import type { BuiltLayout } from "@/lib/layout-versions/build";
import { batchOrders, type WaveOrder } from "@/lib/batching";
import { demoLayout } from "./fixture";

let layout: BuiltLayout;
let onLayout: string;
beforeAll(async () => {
  const demo = await demoLayout();
  layout = demo.layout;
  onLayout = demo.items[0]!.binCode;
});

const reasonOf = (order: WaveOrder) =>
  batchOrders(
    layout.graph,
    layout.matrix,
    [order],
    { totesPerCart: 4, maxLines: 30, maxWeightG: 100_000 },
    { method: "first-come", from: "D1", to: "P1" },
  ).unbatchable[0]?.reason ?? "";

describe("the reason an order cannot be batched for its bins", () => {
  it("names the item master's bins of a line whose item has none on the layout version (never an empty code)", () => {
    const reason = reasonOf({
      orderId: 1,
      orderNumber: "FS-OFF",
      cutoffAt: null,
      priority: 2,
      lines: [
        { lineId: 1, sku: "SKU-ON", binCode: onLayout, quantity: 1, unitWeightG: 100 },
        { lineId: 2, sku: "SKU-OFF", binCode: "", itemBins: ["ZZ-01-1", "ZZ-01-2"], quantity: 1, unitWeightG: 100 },
        { lineId: 3, sku: "SKU-NONE", binCode: "", itemBins: [], quantity: 1, unitWeightG: 100 },
      ],
    });
    expect(reason).toContain("SKU-OFF is in ZZ-01-1 or ZZ-01-2");
    expect(reason).toContain("SKU-NONE has no pick bin in the item master");
    expect(reason).not.toContain("SKU-ON");
    expect(reason).not.toMatch(/\bin\s*[,;.]|from\s*,/);
  });

  it("names the first five lines and counts the rest", () => {
    const lines = Array.from({ length: 8 }, (_, i) => ({
      lineId: i + 1,
      sku: `SKU-${i + 1}`,
      binCode: "",
      itemBins: [`ZZ-0${i + 1}-1`],
      quantity: 1,
      unitWeightG: 100,
    }));
    const reason = reasonOf({ orderId: 2, orderNumber: "FS-MANY", cutoffAt: null, priority: 2, lines });
    for (let i = 1; i <= 5; i++) expect(reason).toContain(`SKU-${i} is in ZZ-0${i}-1`);
    expect(reason).not.toContain("SKU-6");
    expect(reason).toContain("and 3 more lines");
  });
});
